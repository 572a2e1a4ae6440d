import { CaseScreen } from "../../../components/cases/case-screen";

export default CaseScreen;
