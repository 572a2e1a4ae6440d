import { OutboxScreen } from "../../../components/dev/outbox-screen";

export default function Outbox() {
  return <OutboxScreen />;
}
