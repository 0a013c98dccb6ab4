import { createApp } from "./app.js";
import { config } from "./config.js";
import { createDatabase, createPool } from "./db/client.js";

const pool = createPool(config.databaseUrl, config.dbPoolSize);
const app = createApp({ pool, db: createDatabase(pool) });

const server = app.listen(config.port, config.host, () => {
  console.log(`[portfold] serving on http://${config.host === "0.0.0.0" ? "localhost" : config.host}:${config.port}`);
});

function shutdown() {
  server.close(() => void pool.end().then(() => process.exit(0)));
}
process.on("SIGINT", shutdown);
process.on("SIGTERM", shutdown);
