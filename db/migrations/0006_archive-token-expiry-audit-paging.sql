ALTER TABLE "api_tokens" ADD COLUMN "expires_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "gaits" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "gaits" ADD COLUMN "archived_by_id" uuid;--> statement-breakpoint
ALTER TABLE "robots" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "robots" ADD COLUMN "archived_by_id" uuid;--> statement-breakpoint
ALTER TABLE "gaits" ADD CONSTRAINT "gaits_archived_by_id_users_id_fk" FOREIGN KEY ("archived_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "robots" ADD CONSTRAINT "robots_archived_by_id_users_id_fk" FOREIGN KEY ("archived_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "audit_log_workspace_id" ON "audit_log" USING btree ("workspace_id","id");--> statement-breakpoint
CREATE INDEX "audit_log_actor_id" ON "audit_log" USING btree ("actor_id","id");--> statement-breakpoint
CREATE INDEX "audit_log_target" ON "audit_log" USING btree ("target_type","target_id");