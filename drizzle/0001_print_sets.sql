CREATE TYPE "public"."print_set_status" AS ENUM('queued', 'running', 'done', 'failed');--> statement-breakpoint
CREATE TABLE "print_sets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"build_id" uuid NOT NULL,
	"created_by" uuid,
	"name" text NOT NULL,
	"status" "print_set_status" DEFAULT 'queued' NOT NULL,
	"formats" text[] NOT NULL,
	"page" text NOT NULL,
	"mode" text NOT NULL,
	"piece_count" integer NOT NULL,
	"pattern" jsonb NOT NULL,
	"files" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"error" text,
	"job_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "print_sets" ADD CONSTRAINT "print_sets_shop_id_shops_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shops"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "print_sets" ADD CONSTRAINT "print_sets_build_id_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."builds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "print_sets" ADD CONSTRAINT "print_sets_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "print_sets_build_created_idx" ON "print_sets" USING btree ("build_id","created_at" DESC NULLS LAST);