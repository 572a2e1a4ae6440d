import { AuthFrame } from "../../components/auth/auth-frame";
import { SignUpForm } from "../../components/auth/sign-up-form";

export default function SignUp() {
  return (
    <AuthFrame title="Create an account">
      <SignUpForm />
    </AuthFrame>
  );
}
