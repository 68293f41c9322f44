-- Photos of how the cuttings of a strike report rooted: a photo belongs to a plant (and maybe
-- a finding on it) or to one strike report, never both. Removing a report removes its photo
-- rows; the service removes their files once the transaction has committed. The photos table
-- already has its change-notify trigger (0003).
ALTER TABLE "photos" ADD COLUMN "strike_report_id" uuid;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_strike_report_id_strike_reports_id_fk" FOREIGN KEY ("strike_report_id") REFERENCES "public"."strike_reports"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "photos_strike_report_idx" ON "photos" USING btree ("strike_report_id");--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_owner_check" CHECK ("photos"."strike_report_id" is null or ("photos"."plant_id" is null and "photos"."finding_id" is null));
