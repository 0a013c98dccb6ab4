ALTER TABLE "comments" ADD COLUMN "anchor" jsonb;--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "resolved_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "resolved_by" text;--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "reopened_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "reopened_by" text;--> statement-breakpoint
ALTER TABLE "revision_verdicts" ADD COLUMN "role" text;--> statement-breakpoint
ALTER TABLE "revision_verdicts" ADD COLUMN "note" text;--> statement-breakpoint
ALTER TABLE "revision_verdicts" ADD COLUMN "withdraws_id" uuid;--> statement-breakpoint
ALTER TABLE "teams" ADD COLUMN "required_approvals" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "review_mail" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "comments" ADD CONSTRAINT "comments_resolved_by_users_id_fk" FOREIGN KEY ("resolved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comments" ADD CONSTRAINT "comments_reopened_by_users_id_fk" FOREIGN KEY ("reopened_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_verdicts" ADD CONSTRAINT "revision_verdicts_withdraws_fk" FOREIGN KEY ("withdraws_id") REFERENCES "public"."revision_verdicts"("id") ON DELETE cascade ON UPDATE no action;