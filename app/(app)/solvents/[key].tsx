import { useLocalSearchParams } from "expo-router";
import { areaScreen } from "../../../components/shell/area-screen";

const SolventsScreen = areaScreen("SolventsScreen");

export default function SolventRoute() {
  const { key } = useLocalSearchParams<{ key: string }>();
  // keyed, so opening another solvent starts from that solvent's selection
  return <SolventsScreen key={key} selectedKey={key} />;
}
