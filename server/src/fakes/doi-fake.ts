import http from 'node:http';
import type { AddressInfo } from 'node:net';

/**
 * A stand-in for a DOI metadata service on loopback, for development, demos and tests: answers
 * `GET /<doi>` with CSL-JSON (as DOI content negotiation does) for the works below, 404 for any
 * other DOI. The DOIs use 10.5555, a prefix set aside for examples and tests, so none of them can
 * be mistaken for a registered work; every record is demo data of the Kestrel Process Works
 * process-data team and says so.
 */
export interface FakeDoi {
  url: string;
  stop(): Promise<void>;
}

const DEMO = 'Demo data: invented for the Thalpos demo scenario, not a real publication.';
const KESTREL = [
  { family: 'Nandakumar', given: 'Priya' },
  { family: 'Brandt', given: 'Helga' },
];

/** CSL-JSON by lowercase DOI. */
export const FAKE_DOI_RECORDS: Readonly<Record<string, Record<string, unknown>>> = {
  '10.5555/kestrel.demo.2025.001': {
    type: 'report',
    title: 'Bomb calorimetry of plant-grade methanol (demo data)',
    author: KESTREL,
    issued: { 'date-parts': [[2025, 3]] },
    publisher: 'Kestrel Process Works',
    number: 'KPW-PD-2025-001',
    note: DEMO,
  },
  '10.5555/kestrel.demo.2025.002': {
    type: 'article-journal',
    title: 'Heat capacity of a recycled solvent blend between 300 K and 450 K (demo data)',
    author: [{ family: 'Mensah', given: 'Kwame' }, ...KESTREL],
    issued: { 'date-parts': [[2025, 9, 14]] },
    'container-title': 'Kestrel Process Notes',
    volume: '12',
    issue: '3',
    page: '41-57',
    note: DEMO,
  },
  '10.5555/kestrel.demo.2026.003': {
    type: 'book',
    title: 'Process data handbook (demo data)',
    editor: [{ family: 'Sørensen', given: 'Lena' }],
    issued: { 'date-parts': [[2026]] },
    publisher: 'Kestrel Process Works',
    edition: '2',
    note: DEMO,
  },
};

/** A DOI the fake answers with a server error, to exercise the "unreachable" path. */
export const FAKE_DOI_FAILING = '10.5555/kestrel.demo.unavailable';

export async function startFakeDoi({ port = 0 }: { port?: number } = {}): Promise<FakeDoi> {
  const host = '127.0.0.1';
  const server = http.createServer((req, res) => {
    const send = (status: number, type: string, body: string) => {
      res.writeHead(status, { 'Content-Type': type, 'Cache-Control': 'no-store' });
      res.end(body);
    };
    if (req.method !== 'GET') return send(405, 'text/plain', 'GET only');
    let doi: string;
    try {
      doi = decodeURIComponent(
        new URL(req.url ?? '/', 'http://fake').pathname.slice(1),
      ).toLowerCase();
    } catch {
      return send(400, 'text/plain', 'bad path');
    }
    if (doi === FAKE_DOI_FAILING) return send(503, 'text/plain', 'temporarily unavailable');
    const record = FAKE_DOI_RECORDS[doi];
    if (!record) return send(404, 'text/plain', 'DOI Not Found');
    send(
      200,
      'application/vnd.citationstyles.csl+json',
      JSON.stringify({ ...record, DOI: doi.toUpperCase() }),
    );
  });
  await new Promise<void>((resolve) => server.listen(port, host, resolve));
  const { port: bound } = server.address() as AddressInfo;
  return {
    url: `http://${host}:${bound}`,
    stop: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
