import { connectDatabase } from "../server/db/client";
import { isEmpty, seedDemo } from "./demo/channel";

const url = process.env.DATABASE_URL;
if (!url) throw new Error("Set DATABASE_URL (npm start sets it for the local cluster).");
const handle = connectDatabase(url);
try {
  if (await isEmpty(handle.db)) {
    await seedDemo(handle.db);
    console.log("demo channel seeded");
  } else console.log("database already has data; seed skipped");
} finally {
  await handle.close();
}
