// A local fake S3 (s3rver, from the registry) for the S3 pass of the upload tests: one bucket in a temp
// folder, on a free loopback port, printed as one JSON line once it listens.
//   node --openssl-legacy-provider tests/setup/fake-s3-server.mjs <folder> <bucket>
// s3rver 3.7.1 seals its listing continuation tokens with DES, which Node 20's OpenSSL 3 only offers
// through the legacy provider: without the flag any paged listing answers 500.
import S3rver from "s3rver";

const [directory, bucket] = process.argv.slice(2);
const server = new S3rver({ address: "127.0.0.1", port: 0, directory, silent: true, configureBuckets: [{ name: bucket }] });
const { port } = await server.run();
console.log(JSON.stringify({ port }));
process.once("SIGTERM", () => void server.close().then(() => process.exit(0)));
