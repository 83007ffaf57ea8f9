export * from "./roles";
export * from "./table";
export * from "./ability";
