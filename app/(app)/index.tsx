import { HomeScreen } from "../../components/shell/home-screen";

export default HomeScreen;
