export * from "./types";
export * from "./compose";
export * from "./exports";
export * from "./impact";
export * from "./forms";
export * from "./display";
export * from "./route-file";
