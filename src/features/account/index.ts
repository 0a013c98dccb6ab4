export { useUpdateAccountSettings } from "./api/update-account-settings";
export { ApiTokens } from "./components/api-tokens";
