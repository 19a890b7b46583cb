ALTER TABLE "idempotency_keys" ADD COLUMN "lease_token" text;--> statement-breakpoint
ALTER TABLE "idempotency_keys" ADD COLUMN "lease_expires_at" timestamp with time zone;--> statement-breakpoint
CREATE INDEX "sign_in_throttles_updated_at_idx" ON "sign_in_throttles" USING btree ("updated_at");--> statement-breakpoint
CREATE INDEX "idempotency_keys_expires_at_idx" ON "idempotency_keys" USING btree ("expires_at");