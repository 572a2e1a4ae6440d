import { areaScreen } from "../../../components/shell/area-screen";

export default areaScreen("BenchCardScreen");
