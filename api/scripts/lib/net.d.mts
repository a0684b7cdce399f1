// Types for net.mjs, for the tests that need a free port on the loopback interface.
export declare function freePort(): Promise<number>;
export declare function isPortFree(port: number): Promise<boolean>;
export declare function parsePort(value: string | undefined, fallback: number, name: string): number;
export declare function waitForHttp(
  url: string,
  options?: { timeoutMs?: number; child?: unknown; what?: string },
): Promise<Response>;
