import type { Shard } from "./shard.js";

/** Where shardFromEnvironment found the shard, for the one line a command prints about it. */
export interface EnvironmentShard {
  readonly shard: Shard;
  /** The variables it was read from, e.g. "SLURM_ARRAY_TASK_ID=2, SLURM_ARRAY_TASK_MIN=1, SLURM_ARRAY_TASK_COUNT=3". */
  readonly source: string;
}

const whole = (fn: string, name: string, text: string | undefined, min: number): number => {
  const v = text === undefined ? NaN : Number(text.trim());
  if (text === undefined || !/^\s*\d+\s*$/.test(text) || !Number.isSafeInteger(v) || v < min) {
    throw new RangeError(`${fn}: ${name} must be a whole number ≥ ${min}, got ${text === undefined ? "nothing" : JSON.stringify(text)}`);
  }
  return v;
};

/**
 * The shard a scheduler's array task should write, from its environment:
 * - Slurm job arrays (`sbatch --array=A-B[:S]`): shard (SLURM_ARRAY_TASK_ID − SLURM_ARRAY_TASK_MIN)/S + 1 of
 *   SLURM_ARRAY_TASK_COUNT, S = SLURM_ARRAY_TASK_STEP (default 1) (Slurm's documented array variables);
 * - Kubernetes Indexed Jobs: shard JOB_COMPLETION_INDEX + 1 (the index is 0-based) of `count`, the Job's
 *   `completions`, which the pod does not see and so must be given.
 * @param env - the environment (usually process.env).
 * @param count - the number of shards for an Indexed Job (with Slurm, when given, it must equal the task count).
 * @returns the shard and where it came from, or undefined when neither scheduler's variables are set.
 * @throws RangeError naming the variable when a value is not a whole number, the index falls outside the count
 * (e.g. an array given as a list), or an Indexed Job has no count.
 */
export function shardFromEnvironment(env: Readonly<Record<string, string | undefined>>, count?: number): EnvironmentShard | undefined {
  const fn = "shardFromEnvironment";
  if (count !== undefined && !(Number.isSafeInteger(count) && count >= 1)) throw new RangeError(`${fn}: count must be an integer ≥ 1, got ${count}`);
  if (env.SLURM_ARRAY_TASK_ID !== undefined) {
    const id = whole(fn, "SLURM_ARRAY_TASK_ID", env.SLURM_ARRAY_TASK_ID, 0);
    const total = whole(fn, "SLURM_ARRAY_TASK_COUNT", env.SLURM_ARRAY_TASK_COUNT, 1);
    const min = env.SLURM_ARRAY_TASK_MIN === undefined ? 0 : whole(fn, "SLURM_ARRAY_TASK_MIN", env.SLURM_ARRAY_TASK_MIN, 0);
    const step = env.SLURM_ARRAY_TASK_STEP === undefined ? 1 : whole(fn, "SLURM_ARRAY_TASK_STEP", env.SLURM_ARRAY_TASK_STEP, 1);
    const offset = id - min;
    const index = offset / step + 1;
    if (!(Number.isInteger(index) && index >= 1 && index <= total)) {
      throw new RangeError(
        `${fn}: SLURM_ARRAY_TASK_ID=${id} is not task k of an evenly spaced array of ${total} from ${min} by ${step}; submit a range such as --array=1-${total}`,
      );
    }
    if (count !== undefined && count !== total) {
      throw new RangeError(`${fn}: the shard count ${count} differs from SLURM_ARRAY_TASK_COUNT=${total}`);
    }
    return {
      shard: { index, count: total },
      source: `SLURM_ARRAY_TASK_ID=${id}, SLURM_ARRAY_TASK_MIN=${min}, SLURM_ARRAY_TASK_STEP=${step}, SLURM_ARRAY_TASK_COUNT=${total}`,
    };
  }
  if (env.JOB_COMPLETION_INDEX !== undefined) {
    const k = whole(fn, "JOB_COMPLETION_INDEX", env.JOB_COMPLETION_INDEX, 0);
    if (count === undefined) throw new RangeError(`${fn}: JOB_COMPLETION_INDEX is set but no shard count was given (the Job's completions)`);
    if (k >= count) throw new RangeError(`${fn}: JOB_COMPLETION_INDEX=${k} must be below the shard count ${count}`);
    return { shard: { index: k + 1, count }, source: `JOB_COMPLETION_INDEX=${k}, shard count ${count}` };
  }
  return undefined;
}
