// Types for the TypeScript callers of build.mjs (the e2e global setup, the bundle bench).
export type BuildTarget = 'web' | 'api';

export declare const TARGETS: Record<BuildTarget, { inputs: string[]; output: string; stamp: string }>;

/** Content hash of a target's inputs. */
export declare function inputHash(root: string, target: BuildTarget): string;

/** True when the target's output exists and its stamp matches its inputs. */
export declare function isFresh(root: string, target: BuildTarget): boolean;

/** Build the targets whose inputs changed (or all, with force). */
export declare function ensureBuilt(
  root: string,
  targets?: BuildTarget[],
  options?: { force?: boolean; output?: 'inherit' | 'capture' | string },
): Promise<Partial<Record<BuildTarget, 'fresh' | 'built'>>>;
