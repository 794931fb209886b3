export * from "./result";
export * from "./sources";
export * from "./units";
export * from "./premix";
export * from "./tune";
export * from "./readings";
export * from "./tag-code";
export * from "./cautions";
