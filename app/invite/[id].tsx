import { InviteScreen } from "../../components/auth/invite-screen";

export default function Invite() {
  return <InviteScreen />;
}
