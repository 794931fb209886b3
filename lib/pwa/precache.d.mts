export { OFFLINE_ROUTE, RSC_MARK, SHELL_ROUTES } from "./shell-routes.mjs";
export declare function sourceRevision(root: string): string;
export declare function appRoutes(appDir: string): Set<string>;
export declare function shellPrecacheEntries(options: { root: string; revision: string }): {
  entries: { url: string; revision: string }[];
  missing: string[];
};
