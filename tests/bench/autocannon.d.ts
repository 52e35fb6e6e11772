// The part of autocannon's API the bench uses (the package ships no types).
declare module "autocannon" {
  namespace autocannon {
    interface Options {
      url?: string;
      method?: string;
      headers?: Record<string, string>;
      body?: string;
      connections?: number;
      duration?: number;
      amount?: number;
    }
    interface Result {
      requests: { average: number };
      latency: { p50: number; p97_5: number; p99: number; average: number };
      non2xx: number;
      errors: number;
    }
  }
  // eslint-disable-next-line @typescript-eslint/no-unused-vars -- merged into the declared module
  interface Instance extends Promise<autocannon.Result> {
    on(event: "response", listener: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void): this;
  }
  function autocannon(o: autocannon.Options): autocannon.Instance;
  export default autocannon;
}
