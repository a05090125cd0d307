ALTER TABLE "review_links" DROP CONSTRAINT "review_links_deliverable_id_deliverables_id_fk";
--> statement-breakpoint
ALTER TABLE "review_links" ALTER COLUMN "deliverable_id" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "review_links" ADD CONSTRAINT "review_links_deliverable_id_deliverables_id_fk" FOREIGN KEY ("deliverable_id") REFERENCES "public"."deliverables"("id") ON DELETE set null ON UPDATE no action;