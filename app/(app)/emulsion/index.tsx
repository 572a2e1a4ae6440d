import { EmulsionScreen } from "../../../components/emulsion/emulsion-screen";

export default EmulsionScreen;
