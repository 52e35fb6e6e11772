import { describeUploads } from "./uploads-suite";

// The upload tests on S3-compatible storage: a local fake S3 (s3rver) that the suite starts on a free
// port with a temp folder and stops after, so this needs nothing installed beyond npm's packages.
describeUploads("s3");
