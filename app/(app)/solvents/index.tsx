import { SolventsScreen } from "../../../components/solvents/solvents-screen";

export default function SolventsRoute() {
  return <SolventsScreen />;
}
