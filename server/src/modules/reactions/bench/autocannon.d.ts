// The part of autocannon's API the benchmark uses (the package ships no types).
declare module 'autocannon' {
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    headers?: Record<string, string>;
  }
  interface Result {
    requests: { average: number };
    non2xx: number;
    errors: number;
  }
  function autocannon(options: Options): Promise<Result>;
  export = autocannon;
}
