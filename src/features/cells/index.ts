export { useTeamCells } from "./api/get-team-cells";
export { AddCellForm } from "./components/add-cell-form";
export { TeamCells } from "./components/team-cells";
