import { SolventChoiceScreen } from "../../../components/plan/solvent-choice-screen";

export default SolventChoiceScreen;
