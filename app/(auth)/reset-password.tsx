import { AuthFrame } from "../../components/auth/auth-frame";
import { ResetPasswordForm } from "../../components/auth/reset-password-form";

export default function ResetPassword() {
  return (
    <AuthFrame title="Choose a new password">
      <ResetPasswordForm />
    </AuthFrame>
  );
}
