export { AttachmentsSection } from "./components/attachments-section";
