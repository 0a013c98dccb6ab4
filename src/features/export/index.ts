export { ExportMenu } from "./components/export-menu";
