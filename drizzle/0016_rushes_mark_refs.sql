ALTER TABLE "clip_marks" ADD COLUMN "bench_run_id" uuid;--> statement-breakpoint
ALTER TABLE "clip_marks" ADD COLUMN "build_iteration_id" uuid;--> statement-breakpoint
ALTER TABLE "clip_marks" ADD CONSTRAINT "clip_marks_bench_run_id_bench_runs_id_fk" FOREIGN KEY ("bench_run_id") REFERENCES "public"."bench_runs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clip_marks" ADD CONSTRAINT "clip_marks_build_iteration_id_build_iterations_id_fk" FOREIGN KEY ("build_iteration_id") REFERENCES "public"."build_iterations"("id") ON DELETE set null ON UPDATE no action;