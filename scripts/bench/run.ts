// npm run bench: every benchmark, printed as figures. The HTTP ones run when
// scripts/bench.sh has started the app (GAITLOOM_BENCH_URL and _TOKEN set).
import { benchExport } from "./export";
import { benchGait } from "./gait";
import { benchKinematics } from "./kinematics";
import { eq } from "drizzle-orm";
import { createDatabase } from "../../db/client";
import { gaits } from "../../db/schema";
import { benchHeavyWork, benchSolveApi, benchTableApi } from "./http";

console.log(`Gaitloom benchmarks on ${process.version}, ${new Date().toISOString()}\n`);
console.log("== kinematics");
await benchKinematics();
console.log("\n== gait engine");
await benchGait();
console.log("\n== firmware export");
await benchExport();
const url = process.env.GAITLOOM_BENCH_URL;
const token = process.env.GAITLOOM_BENCH_TOKEN;
const appPid = Number(process.env.GAITLOOM_BENCH_APP_PID) || undefined;
if (url && token) {
  console.log("\n== HTTP on loopback");
  await benchSolveApi(url, token, appPid);
  const { db, client } = createDatabase(process.env.DATABASE_URL!, { max: 1 });
  const [gait] = await db.select({ id: gaits.id }).from(gaits).where(eq(gaits.name, "Tripod cruise"));
  await client.end();
  await benchTableApi(url, token, gait.id, appPid);
  const noPoolUrl = process.env.GAITLOOM_BENCH_NO_POOL_URL;
  if (noPoolUrl) {
    console.log("\n== heavy work on the worker pool, and on the request thread (GAITLOOM_SOLVE_POOL=off)");
    await benchHeavyWork(url, noPoolUrl, token);
  }
} else {
  console.log("\n(HTTP benchmarks skipped: run them through `npm run bench`, which starts the app.)");
}
