import { execFileSync } from 'node:child_process';
import { mkdtemp, readFile, readdir, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { fileChecksum } from '../batch/input-checksums.js';
import { InputError } from '../inputs/input-error.js';
import { archiveInput, rejectInput, rejectionOf } from './archive-and-reject.js';
import { dropLayout, ensureDropLayout } from './layout.js';
import { openLedger } from './ledger.js';

async function freshLayout() {
  const layout = dropLayout(await mkdtemp(path.join(tmpdir(), 'clino-drop-')));
  await ensureDropLayout(layout);
  return layout;
}

describe('archive and reject moves', () => {
  it('archives into archive/<day>/ beside a checksum file that sha256sum -c accepts', async () => {
    const layout = await freshLayout();
    const file = path.join(layout.incoming, 'prices-1.csv');
    await writeFile(file, 'date,A\n2026-01-02,1\n');
    const target = await archiveInput(layout, file, (await fileChecksum(file)).sha256, '2026-12-01');
    expect(target).toBe(path.join(layout.archive, '2026-12-01', 'prices-1.csv'));
    // coreutils sha256sum checks the recorded checksum against the archived bytes.
    const verdict = execFileSync('sha256sum', ['-c', 'prices-1.csv.sha256'], { cwd: path.dirname(target), encoding: 'utf8' });
    expect(verdict.trim()).toBe('prices-1.csv: OK');
    expect(await readdir(layout.incoming)).toEqual([]);
  });

  it('never overwrites: a second file of the same name is archived as name~2', async () => {
    const layout = await freshLayout();
    for (const content of ['first\n', 'second\n']) {
      const file = path.join(layout.incoming, 'prices-1.csv');
      await writeFile(file, content);
      await archiveInput(layout, file, (await fileChecksum(file)).sha256, '2026-12-01');
    }
    const day = path.join(layout.archive, '2026-12-01');
    expect((await readdir(day)).sort()).toEqual(['prices-1.csv', 'prices-1.csv.sha256', 'prices-1~2.csv', 'prices-1~2.csv.sha256']);
    expect(await readFile(path.join(day, 'prices-1.csv'), 'utf8')).toBe('first\n');
  });

  it('rejects beside an error file naming file, line, column and reason', async () => {
    const layout = await freshLayout();
    const file = path.join(layout.incoming, 'prices-2.csv');
    await writeFile(file, 'x');
    const error = new InputError({ code: 'INPUT_BAD_PRICE', file, line: 14, column: 3, columnName: 'QZ-B', reason: 'price "abc" is not a number' });
    const target = await rejectInput(layout, file, rejectionOf(error), 'core');
    const text = await readFile(`${target}.error.txt`, 'utf8');
    expect(text).toContain('at: prices-2.csv:14:3 price "abc" is not a number (column "QZ-B")');
    expect(text).toContain('code: INPUT_BAD_PRICE');
  });
});

describe('the ledger', () => {
  it('remembers runs across openings and survives a line torn by a crash', async () => {
    const layout = await freshLayout();
    await writeFile(layout.ledgerFile, '{"kind":"run","runKey":"k1"}\n{"kind":"run","runK');
    const ledger = await openLedger(layout.ledgerFile);
    expect(ledger.hasRun('k1')).toBe(true);
    await ledger.append({ kind: 'duplicate', name: 'a.csv', sha256: 'x', at: '2026-12-01T00:00:00Z' });
    await ledger.append({ kind: 'run', runKey: 'k2', spec: 's', specSha256: 'x', asOf: '2026-11-30', deliveryKey: 'd', inputs: [], at: 't' });
    const reopened = await openLedger(layout.ledgerFile);
    expect([reopened.hasRun('k1'), reopened.hasRun('k2'), reopened.hasRun('k3')]).toEqual([true, true, false]);
    expect((await readFile(layout.ledgerFile, 'utf8')).split('\n')[2]).toBe('{"kind":"duplicate","name":"a.csv","sha256":"x","at":"2026-12-01T00:00:00Z"}');
  });
});
