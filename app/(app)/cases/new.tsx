import { NewCaseScreen } from "../../../components/cases/new-case-screen";

export default NewCaseScreen;
