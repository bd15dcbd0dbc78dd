export declare function freePorts(count: number): Promise<number[]>;
export declare function freePort(): Promise<number>;
