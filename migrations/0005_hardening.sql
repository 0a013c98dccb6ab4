ALTER TABLE "solve_jobs" ADD COLUMN "runner" text;--> statement-breakpoint
-- Sessions are now keyed by the SHA-256 of the cookie's token; rows keyed by a raw cookie value can never match again.
DELETE FROM "sessions";
