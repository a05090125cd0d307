CREATE TYPE "public"."build_outcome" AS ENUM('pending', 'worked', 'partly', 'failed');--> statement-breakpoint
CREATE TYPE "public"."part_kind" AS ENUM('motor', 'propeller', 'fan', 'battery', 'speed_controller', 'frame', 'other');--> statement-breakpoint
CREATE TYPE "public"."clip_rating" AS ENUM('select', 'maybe', 'reject');--> statement-breakpoint
CREATE TYPE "public"."shot_kind" AS ENUM('talking_head', 'build_closeup', 'test_run', 'slow_motion', 'aerial', 'insert', 'pickup');--> statement-breakpoint
CREATE TYPE "public"."shot_priority" AS ENUM('must', 'normal', 'spare');--> statement-breakpoint
CREATE TYPE "public"."shot_status" AS ENUM('planned', 'captured', 'dropped');--> statement-breakpoint
CREATE TYPE "public"."upload_status" AS ENUM('uploading', 'completed', 'cancelled', 'abandoned');--> statement-breakpoint
CREATE TYPE "public"."deal_state" AS ENUM('negotiating', 'signed', 'live', 'wrapped', 'cancelled');--> statement-breakpoint
CREATE TYPE "public"."deliverable_anchor" AS ENUM('before_publish', 'after_go_live', 'fixed');--> statement-breakpoint
CREATE TYPE "public"."deliverable_kind" AS ENUM('script_draft', 'script_approval', 'draft_cut', 'final_approval', 'go_live', 'report', 'invoice', 'payment', 'other');--> statement-breakpoint
CREATE TYPE "public"."deliverable_status" AS ENUM('not_started', 'sent', 'changes_asked', 'approved', 'done');--> statement-breakpoint
CREATE TYPE "public"."payment_terms_from" AS ENUM('go_live', 'invoice');--> statement-breakpoint
CREATE TYPE "public"."deal_placement" AS ENUM('opening', 'middle', 'end');--> statement-breakpoint
CREATE TYPE "public"."review_decision" AS ENUM('approved', 'changes_asked');--> statement-breakpoint
CREATE TABLE "bench_parts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"name" text NOT NULL,
	"kind" "part_kind" NOT NULL,
	"mass" jsonb,
	"rated_voltage" jsonb,
	"rated_current" jsonb,
	"price_amount" numeric(10, 2),
	"price_currency" text,
	"supplier" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "bench_run_parts" (
	"run_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"channel_id" uuid NOT NULL,
	"count" integer NOT NULL,
	"position" integer NOT NULL,
	CONSTRAINT "bench_run_parts_run_id_part_id_pk" PRIMARY KEY("run_id","part_id")
);
--> statement-breakpoint
CREATE TABLE "bench_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"label" text NOT NULL,
	"supply" jsonb,
	"measurements" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "bench_runs_episode_number_key" UNIQUE("episode_id","number")
);
--> statement-breakpoint
CREATE TABLE "build_iterations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"change" text NOT NULL,
	"all_up_mass" jsonb,
	"outcome" "build_outcome" DEFAULT 'pending' NOT NULL,
	"chosen_run_id" uuid,
	"notes" text DEFAULT '' NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "build_iterations_episode_number_key" UNIQUE("episode_id","number")
);
--> statement-breakpoint
CREATE TABLE "safety_hazards" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"title" text,
	"mitigation" text NOT NULL,
	"checked_by" uuid,
	"checked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "test_criteria" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"definition" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "test_plans" (
	"episode_id" uuid PRIMARY KEY NOT NULL,
	"channel_id" uuid NOT NULL,
	"hypothesis" text DEFAULT '' NOT NULL,
	"method" text DEFAULT '' NOT NULL,
	"quantities" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"airframe_mass" jsonb,
	"updated_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "clip_marks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"clip_id" uuid NOT NULL,
	"in_frame" integer NOT NULL,
	"out_frame" integer NOT NULL,
	"in_label" text NOT NULL,
	"out_label" text NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "clips" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"shoot_day_id" uuid,
	"shot_id" uuid,
	"bench_run_id" uuid,
	"build_iteration_id" uuid,
	"uploaded_by" uuid,
	"object_key" text NOT NULL,
	"poster_key" text,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"storage_etag" text,
	"sha256" text,
	"duration_ms" integer DEFAULT 0 NOT NULL,
	"frame_rate_numerator" integer,
	"frame_rate_denominator" integer,
	"drop_frame" boolean DEFAULT false NOT NULL,
	"width" integer,
	"height" integer,
	"codec" text,
	"start_timecode" text,
	"camera" text DEFAULT '' NOT NULL,
	"recorded_at" timestamp with time zone NOT NULL,
	"kind" "shot_kind",
	"rating" "clip_rating",
	"tags" text[] DEFAULT '{}'::text[] NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"mark_count" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "clips_object_key_unique" UNIQUE("object_key")
);
--> statement-breakpoint
CREATE TABLE "shoot_day_crew" (
	"shoot_day_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	CONSTRAINT "shoot_day_crew_shoot_day_id_user_id_pk" PRIMARY KEY("shoot_day_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "shoot_days" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"day" date NOT NULL,
	"place" text DEFAULT '' NOT NULL,
	"call_time" text,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"shoot_day_id" uuid,
	"description" text NOT NULL,
	"kind" "shot_kind" NOT NULL,
	"priority" "shot_priority" DEFAULT 'normal' NOT NULL,
	"status" "shot_status" DEFAULT 'planned' NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "stills" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid,
	"object_key" text NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stills_object_key_unique" UNIQUE("object_key")
);
--> statement-breakpoint
CREATE TABLE "upload_parts" (
	"upload_id" uuid NOT NULL,
	"part_number" integer NOT NULL,
	"etag" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "upload_parts_upload_id_part_number_pk" PRIMARY KEY("upload_id","part_number")
);
--> statement-breakpoint
CREATE TABLE "uploads" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"created_by" uuid,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"part_size" integer NOT NULL,
	"part_count" integer NOT NULL,
	"object_key" text NOT NULL,
	"storage_upload_id" text NOT NULL,
	"status" "upload_status" DEFAULT 'uploading' NOT NULL,
	"metadata" jsonb,
	"fingerprint" text DEFAULT '' NOT NULL,
	"clip_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_activity_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone,
	CONSTRAINT "uploads_object_key_unique" UNIQUE("object_key")
);
--> statement-breakpoint
CREATE TABLE "deal_templates" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"name" text NOT NULL,
	"items" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "deals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"sponsor_id" uuid NOT NULL,
	"contact_id" uuid,
	"host_id" uuid,
	"state" "deal_state" DEFAULT 'negotiating' NOT NULL,
	"placement" "deal_placement" NOT NULL,
	"segment_seconds" integer NOT NULL,
	"talking_points" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"link" text,
	"promo_code" text,
	"disclosure_text" text,
	"exclusivity_notes" text,
	"description_copy" text,
	"script" text DEFAULT '' NOT NULL,
	"go_live_date" date,
	"publish_basis" date,
	"fee_amount" numeric(14, 2) NOT NULL,
	"currency" text NOT NULL,
	"payment_terms_days" integer NOT NULL,
	"payment_terms_from" "payment_terms_from" NOT NULL,
	"invoice_number" text,
	"invoiced_on" date,
	"paid_on" date,
	"cut_clip_id" uuid,
	"cut_in" text,
	"cut_out" text,
	"cut_frame_rate" text,
	"cut_drop_frame" boolean,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "deliverable_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"deliverable_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"actor_kind" text NOT NULL,
	"what" text NOT NULL,
	"from_status" text,
	"to_status" text,
	"from_date" date,
	"to_date" date,
	"note" text
);
--> statement-breakpoint
CREATE TABLE "deliverables" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"deal_id" uuid NOT NULL,
	"kind" "deliverable_kind" NOT NULL,
	"title" text NOT NULL,
	"anchor" "deliverable_anchor" NOT NULL,
	"offset_days" integer DEFAULT 0 NOT NULL,
	"due_date" date,
	"status" "deliverable_status" DEFAULT 'not_started' NOT NULL,
	"owner_id" uuid,
	"position" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reminders_sent" (
	"deliverable_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"due_date" date NOT NULL,
	"sent_to" text NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "reminders_sent_deliverable_id_kind_due_date_pk" PRIMARY KEY("deliverable_id","kind","due_date")
);
--> statement-breakpoint
CREATE TABLE "review_links" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"deal_id" uuid NOT NULL,
	"deliverable_id" uuid NOT NULL,
	"contact_id" uuid,
	"contact_name" text NOT NULL,
	"contact_email" text NOT NULL,
	"sent_by" uuid,
	"sent_by_name" text NOT NULL,
	"sent_by_email" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"revoked_at" timestamp with time zone,
	"decided_at" timestamp with time zone,
	"decision" "review_decision",
	"comment" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "speaking_rates" (
	"channel_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"words_per_minute" integer NOT NULL,
	CONSTRAINT "speaking_rates_channel_id_user_id_pk" PRIMARY KEY("channel_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "sponsor_contacts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"sponsor_id" uuid NOT NULL,
	"name" text NOT NULL,
	"email" text NOT NULL,
	"role" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sponsor_settings" (
	"channel_id" uuid PRIMARY KEY NOT NULL,
	"reminder_days_before" integer DEFAULT 2 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sponsors" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"company" text NOT NULL,
	"website" text,
	"notes" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "bench_parts" ADD CONSTRAINT "bench_parts_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_run_parts" ADD CONSTRAINT "bench_run_parts_run_id_bench_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."bench_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_run_parts" ADD CONSTRAINT "bench_run_parts_part_id_bench_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."bench_parts"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_run_parts" ADD CONSTRAINT "bench_run_parts_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_runs" ADD CONSTRAINT "bench_runs_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_runs" ADD CONSTRAINT "bench_runs_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_runs" ADD CONSTRAINT "bench_runs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_iterations" ADD CONSTRAINT "build_iterations_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_iterations" ADD CONSTRAINT "build_iterations_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_iterations" ADD CONSTRAINT "build_iterations_chosen_run_id_bench_runs_id_fk" FOREIGN KEY ("chosen_run_id") REFERENCES "public"."bench_runs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_iterations" ADD CONSTRAINT "build_iterations_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "safety_hazards" ADD CONSTRAINT "safety_hazards_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "safety_hazards" ADD CONSTRAINT "safety_hazards_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "safety_hazards" ADD CONSTRAINT "safety_hazards_checked_by_users_id_fk" FOREIGN KEY ("checked_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_criteria" ADD CONSTRAINT "test_criteria_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_criteria" ADD CONSTRAINT "test_criteria_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_plans" ADD CONSTRAINT "test_plans_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_plans" ADD CONSTRAINT "test_plans_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_plans" ADD CONSTRAINT "test_plans_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clip_marks" ADD CONSTRAINT "clip_marks_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clip_marks" ADD CONSTRAINT "clip_marks_clip_id_clips_id_fk" FOREIGN KEY ("clip_id") REFERENCES "public"."clips"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clip_marks" ADD CONSTRAINT "clip_marks_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_shot_id_shots_id_fk" FOREIGN KEY ("shot_id") REFERENCES "public"."shots"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clips" ADD CONSTRAINT "clips_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_day_crew" ADD CONSTRAINT "shoot_day_crew_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_day_crew" ADD CONSTRAINT "shoot_day_crew_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD CONSTRAINT "shoot_days_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shoot_days" ADD CONSTRAINT "shoot_days_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shots" ADD CONSTRAINT "shots_shoot_day_id_shoot_days_id_fk" FOREIGN KEY ("shoot_day_id") REFERENCES "public"."shoot_days"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stills" ADD CONSTRAINT "stills_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stills" ADD CONSTRAINT "stills_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stills" ADD CONSTRAINT "stills_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "upload_parts" ADD CONSTRAINT "upload_parts_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deal_templates" ADD CONSTRAINT "deal_templates_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deals" ADD CONSTRAINT "deals_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deals" ADD CONSTRAINT "deals_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deals" ADD CONSTRAINT "deals_sponsor_id_sponsors_id_fk" FOREIGN KEY ("sponsor_id") REFERENCES "public"."sponsors"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deals" ADD CONSTRAINT "deals_contact_id_sponsor_contacts_id_fk" FOREIGN KEY ("contact_id") REFERENCES "public"."sponsor_contacts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deals" ADD CONSTRAINT "deals_host_id_users_id_fk" FOREIGN KEY ("host_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deals" ADD CONSTRAINT "deals_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliverable_events" ADD CONSTRAINT "deliverable_events_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliverable_events" ADD CONSTRAINT "deliverable_events_deliverable_id_deliverables_id_fk" FOREIGN KEY ("deliverable_id") REFERENCES "public"."deliverables"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliverable_events" ADD CONSTRAINT "deliverable_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliverables" ADD CONSTRAINT "deliverables_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliverables" ADD CONSTRAINT "deliverables_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliverables" ADD CONSTRAINT "deliverables_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminders_sent" ADD CONSTRAINT "reminders_sent_deliverable_id_deliverables_id_fk" FOREIGN KEY ("deliverable_id") REFERENCES "public"."deliverables"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_links" ADD CONSTRAINT "review_links_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_links" ADD CONSTRAINT "review_links_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_links" ADD CONSTRAINT "review_links_deliverable_id_deliverables_id_fk" FOREIGN KEY ("deliverable_id") REFERENCES "public"."deliverables"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_links" ADD CONSTRAINT "review_links_contact_id_sponsor_contacts_id_fk" FOREIGN KEY ("contact_id") REFERENCES "public"."sponsor_contacts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_links" ADD CONSTRAINT "review_links_sent_by_users_id_fk" FOREIGN KEY ("sent_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "speaking_rates" ADD CONSTRAINT "speaking_rates_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "speaking_rates" ADD CONSTRAINT "speaking_rates_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sponsor_contacts" ADD CONSTRAINT "sponsor_contacts_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sponsor_contacts" ADD CONSTRAINT "sponsor_contacts_sponsor_id_sponsors_id_fk" FOREIGN KEY ("sponsor_id") REFERENCES "public"."sponsors"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sponsor_settings" ADD CONSTRAINT "sponsor_settings_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sponsors" ADD CONSTRAINT "sponsors_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bench_parts_channel_idx" ON "bench_parts" USING btree ("channel_id","name");--> statement-breakpoint
CREATE INDEX "bench_run_parts_part_idx" ON "bench_run_parts" USING btree ("channel_id","part_id");--> statement-breakpoint
CREATE INDEX "bench_runs_channel_episode_idx" ON "bench_runs" USING btree ("channel_id","episode_id");--> statement-breakpoint
CREATE INDEX "build_iterations_channel_episode_idx" ON "build_iterations" USING btree ("channel_id","episode_id");--> statement-breakpoint
CREATE INDEX "safety_hazards_episode_idx" ON "safety_hazards" USING btree ("channel_id","episode_id");--> statement-breakpoint
CREATE INDEX "test_criteria_episode_idx" ON "test_criteria" USING btree ("channel_id","episode_id","position");--> statement-breakpoint
CREATE INDEX "clip_marks_clip_idx" ON "clip_marks" USING btree ("clip_id","in_frame");--> statement-breakpoint
CREATE INDEX "clips_channel_episode_recorded_idx" ON "clips" USING btree ("channel_id","episode_id","recorded_at","id");--> statement-breakpoint
CREATE INDEX "clips_channel_recorded_idx" ON "clips" USING btree ("channel_id","recorded_at","id");--> statement-breakpoint
CREATE INDEX "clips_channel_rating_idx" ON "clips" USING btree ("channel_id","rating","recorded_at","id");--> statement-breakpoint
CREATE INDEX "clips_shot_idx" ON "clips" USING btree ("shot_id");--> statement-breakpoint
CREATE INDEX "clips_shoot_day_idx" ON "clips" USING btree ("shoot_day_id");--> statement-breakpoint
CREATE INDEX "clips_tags_idx" ON "clips" USING gin ("tags");--> statement-breakpoint
CREATE INDEX "shoot_days_channel_episode_idx" ON "shoot_days" USING btree ("channel_id","episode_id","day");--> statement-breakpoint
CREATE INDEX "shots_channel_episode_idx" ON "shots" USING btree ("channel_id","episode_id","position");--> statement-breakpoint
CREATE INDEX "shots_shoot_day_idx" ON "shots" USING btree ("shoot_day_id");--> statement-breakpoint
CREATE INDEX "stills_channel_idx" ON "stills" USING btree ("channel_id","created_at");--> statement-breakpoint
CREATE INDEX "uploads_channel_episode_status_idx" ON "uploads" USING btree ("channel_id","episode_id","status");--> statement-breakpoint
CREATE INDEX "uploads_open_activity_idx" ON "uploads" USING btree ("last_activity_at") WHERE "uploads"."status" = 'uploading';--> statement-breakpoint
CREATE INDEX "deal_templates_channel_idx" ON "deal_templates" USING btree ("channel_id");--> statement-breakpoint
CREATE INDEX "deals_channel_episode_idx" ON "deals" USING btree ("channel_id","episode_id");--> statement-breakpoint
CREATE INDEX "deals_sponsor_idx" ON "deals" USING btree ("sponsor_id");--> statement-breakpoint
CREATE INDEX "deliverable_events_item_idx" ON "deliverable_events" USING btree ("deliverable_id","at");--> statement-breakpoint
CREATE INDEX "deliverables_deal_idx" ON "deliverables" USING btree ("deal_id");--> statement-breakpoint
CREATE INDEX "deliverables_channel_due_idx" ON "deliverables" USING btree ("channel_id","due_date");--> statement-breakpoint
CREATE INDEX "review_links_deal_idx" ON "review_links" USING btree ("deal_id");--> statement-breakpoint
CREATE INDEX "sponsor_contacts_sponsor_idx" ON "sponsor_contacts" USING btree ("sponsor_id");--> statement-breakpoint
CREATE INDEX "sponsors_channel_idx" ON "sponsors" USING btree ("channel_id");