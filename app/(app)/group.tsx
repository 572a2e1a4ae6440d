import { GroupScreen } from "../../components/group/group-screen";

export default GroupScreen;
