export declare const appNodeFlags: string[];
