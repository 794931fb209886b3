export * from "./rounding";
export * from "./format";
export * from "./labor";
export * from "./invoice";
