import { DeskScreen } from "../../../components/desk/desk-screen";

export default function Desk() {
  return <DeskScreen />;
}
