// The prior betas for the `big-move` flag: each security's adjusted beta in the last released run of
// the same spec, fetched from the server (runs list, then the run's results page by page).
import { z } from 'zod';
import type { ServerClient } from './server-client.js';
import { parseAnswer } from './spec-answers.js';

const runsPage = z.object({ items: z.array(z.object({ id: z.string(), asOf: z.string() })) });
const resultsPage = z.object({
  items: z.array(z.object({ security: z.string(), record: z.record(z.string(), z.unknown()) })),
  total: z.number().int(),
});

const PAGE_SIZE = 500;

export async function lastReleasedBetas(client: ServerClient, specName: string): Promise<Map<string, number>> {
  const query = `spec=${encodeURIComponent(specName)}&state=released&sort=-asOf&pageSize=1`;
  const runs = parseAnswer(runsPage, (await client.request('GET', `/api/runs?${query}`)).json(), 'GET /api/runs');
  const betas = new Map<string, number>();
  const run = runs.items[0];
  if (run === undefined) return betas;
  for (let page = 1; ; page += 1) {
    const path = `/api/runs/${encodeURIComponent(run.id)}/results?page=${page}&pageSize=${PAGE_SIZE}`;
    const answer = parseAnswer(resultsPage, (await client.request('GET', path)).json(), `GET /api/runs/${run.id}/results`);
    for (const item of answer.items) {
      const beta = item.record['adjusted_beta'];
      if (typeof beta === 'number') betas.set(item.security, beta);
    }
    if (page * PAGE_SIZE >= answer.total || answer.items.length === 0) return betas;
  }
}
