import { AuthFrame } from "../../components/auth/auth-frame";
import { ForgotPasswordForm } from "../../components/auth/forgot-password-form";

export default function ForgotPassword() {
  return (
    <AuthFrame title="Forgot your password?">
      <ForgotPasswordForm />
    </AuthFrame>
  );
}
