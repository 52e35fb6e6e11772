import { describeUploads } from "./uploads-suite";

// The upload tests on the default store, local disk (a temp folder of this file's own).
describeUploads("disk");
