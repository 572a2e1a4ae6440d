import { SavedPlanScreen } from "../../../components/plan/saved-plan-screen";

export default SavedPlanScreen;
