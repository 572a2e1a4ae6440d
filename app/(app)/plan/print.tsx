import { BenchCardScreen } from "../../../components/plan/bench-card-screen";

export default BenchCardScreen;
