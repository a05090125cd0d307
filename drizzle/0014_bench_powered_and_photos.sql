CREATE TABLE "build_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"iteration_id" uuid NOT NULL,
	"object_key" text NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "build_photos_object_key_unique" UNIQUE("object_key")
);
--> statement-breakpoint
ALTER TABLE "bench_parts" ADD COLUMN "powered" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "build_photos" ADD CONSTRAINT "build_photos_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_photos" ADD CONSTRAINT "build_photos_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_photos" ADD CONSTRAINT "build_photos_iteration_id_build_iterations_id_fk" FOREIGN KEY ("iteration_id") REFERENCES "public"."build_iterations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_photos" ADD CONSTRAINT "build_photos_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "build_photos_iteration_idx" ON "build_photos" USING btree ("channel_id","iteration_id","created_at");