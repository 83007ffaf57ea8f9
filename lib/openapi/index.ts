export { errorBodySchema, pathsOf, withoutFields, type ApiRoute, type HttpMethod, type InputPlace, type ResponseKind } from "./build";
export { API_VERSION, openApiDocument } from "./document";
export { API_ROUTES, UNDOCUMENTED_ROUTES } from "./routes";
