import { appendFileSync } from "node:fs";

/** Load hook: records each module's URL, then loads it as usual. */
export async function load(url, context, next) {
  if (process.env.FLOORCAST_MODULE_LIST) appendFileSync(process.env.FLOORCAST_MODULE_LIST, `${url}\n`);
  return next(url, context);
}
