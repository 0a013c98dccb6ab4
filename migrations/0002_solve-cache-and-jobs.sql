CREATE TABLE "solve_cache" (
	"key" text PRIMARY KEY NOT NULL,
	"derivation" jsonb NOT NULL,
	"hits" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_used_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "solve_jobs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"network_id" uuid NOT NULL,
	"requested_by" text,
	"status" text NOT NULL,
	"cache_hit" boolean,
	"revision_number" integer,
	"error" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "solve_jobs" ADD CONSTRAINT "solve_jobs_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "solve_jobs" ADD CONSTRAINT "solve_jobs_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "solve_cache_last_used_idx" ON "solve_cache" USING btree ("last_used_at");--> statement-breakpoint
CREATE INDEX "solve_jobs_network_idx" ON "solve_jobs" USING btree ("network_id");--> statement-breakpoint
CREATE INDEX "solve_jobs_finished_idx" ON "solve_jobs" USING btree ("finished_at");