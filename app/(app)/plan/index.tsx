import { PlanScreen } from "../../../components/plan/plan-screen";

export default PlanScreen;
