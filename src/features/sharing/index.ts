export { useSharedRevision } from "./api/get-shared-revision";
export { ShareDialog } from "./components/share-dialog";
