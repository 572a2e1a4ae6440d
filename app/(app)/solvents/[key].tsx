import { useLocalSearchParams } from "expo-router";
import { SolventsScreen } from "../../../components/solvents/solvents-screen";

export default function SolventRoute() {
  const { key } = useLocalSearchParams<{ key: string }>();
  // keyed, so opening another solvent starts from that solvent's selection
  return <SolventsScreen key={key} selectedKey={key} />;
}
