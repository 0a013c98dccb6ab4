export { networkQueryOptions, useNetwork } from "./api/get-network";
export { useNetworkBySlug } from "./api/get-network-by-slug";
export { useUpdateNetwork } from "./api/update-network";
export type { UpdateNetworkInput } from "./api/update-network";
export { CreateNetworkDialog } from "./components/create-network-dialog";
export { ImportNetworkDialog } from "./components/import-network-dialog";
export { NetworkHeading } from "./components/network-heading";
export { NetworksTable } from "./components/networks-table";
