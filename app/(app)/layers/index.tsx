import { LayerCheckScreen } from "../../../components/layers/layer-check-screen";

export default LayerCheckScreen;
