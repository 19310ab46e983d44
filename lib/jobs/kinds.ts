import "server-only";
// Every kind of job, registered by importing its module: whoever watches, cancels or runs a job
// (the jobs API, a worker process) needs all of them, whichever route started the job.
import "@/lib/layout-versions/publish";
import "@/lib/waves/plan-wave";
import "@/lib/waves/compare-plans";
