export declare const SHELL_ROUTES: string[];
export declare const OFFLINE_ROUTE: string;
export declare const RSC_MARK: string;
