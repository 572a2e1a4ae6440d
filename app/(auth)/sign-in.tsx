import { AuthFrame } from "../../components/auth/auth-frame";
import { SignInForm } from "../../components/auth/sign-in-form";

export default function SignIn() {
  return (
    <AuthFrame title="Sign in">
      <SignInForm />
    </AuthFrame>
  );
}
