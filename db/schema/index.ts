export * from "./auth";
export * from "./materials";
export * from "./formulations";
export * from "./records";
export * from "./quality";
export * from "./explorations";
