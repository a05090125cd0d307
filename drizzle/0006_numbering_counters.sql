CREATE TABLE "counters" (
	"scope" text NOT NULL,
	"owner_id" uuid NOT NULL,
	"channel_id" uuid NOT NULL,
	"last" integer NOT NULL,
	CONSTRAINT "counters_scope_owner_id_pk" PRIMARY KEY("scope","owner_id")
);
--> statement-breakpoint
ALTER TABLE "counters" ADD CONSTRAINT "counters_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;