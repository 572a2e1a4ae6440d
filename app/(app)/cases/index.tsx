import { CasesScreen } from "../../../components/cases/cases-screen";

export default CasesScreen;
