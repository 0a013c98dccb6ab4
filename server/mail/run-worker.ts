// A mail worker on its own (`npm run mail:worker`): delivers what any server process queued in DATABASE_URL.
import { config, defaultSettings } from "../config.js";
import { createLogger } from "../lib/logging.js";
import { createSmtpMailer, smtpTarget } from "./mailer.js";
import { startMailBoss, startMailWorker, stopMailBoss } from "./queue.js";

const log = createLogger(config.logLevel);
const mailQueue = defaultSettings().mailQueue;
const boss = await startMailBoss(config.databaseUrl, mailQueue, log);
await startMailWorker(boss, mailQueue, createSmtpMailer(smtpTarget(), config.mail.from, log));
console.log(`[portfold] mail worker delivering the "${mailQueue.queue}" queue`);
const stop = () => void stopMailBoss(boss).then(() => process.exit(0));
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
