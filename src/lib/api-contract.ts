// The one door from the client to the API contract (shared/api): the types of what the server sends and takes.
export type { ApiToken, CreateTokenRequest, CreatedToken, TokenList, TokenScope } from "../../shared/api/tokens";
