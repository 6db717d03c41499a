export declare function defaultAppWorkers(): number;
