import { beforeAll, describe, expect, it } from 'vitest';
import { PvString } from '../../apps/api/src/models/index.ts';
import { demoEmail, errorOf, resetDatabase, signIn, type Agent } from './helpers.ts';

let dispatcher: Agent;
let tech: Agent;
let siteIds: Record<string, number>;

beforeAll(async () => {
  await resetDatabase({ plant: true });
  dispatcher = await signIn(demoEmail.dispatcher);
  tech = await signIn(demoEmail.technician);
  const sites = await dispatcher.get('/api/sites').expect(200);
  siteIds = Object.fromEntries(sites.body.items.map((s: { code: string; id: number }) => [s.code, s.id]));
});

function upload(agent: Agent, siteId: number, content: string | Buffer, mode: 'dry-run' | 'commit', name = 'layout.csv') {
  return agent
    .post(`/api/sites/${siteId}/import?mode=${mode}`)
    .set('x-csrf-token', agent.csrf)
    .attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content, 'utf8'), name);
}

const header = 'label,inverter,mppt_input,combiner,position,module_model,modules_in_series\n';
const good = `${header}INV01-MPPT1-S3,INV01,1,,,SDM-330-60P,18\nINV01-MPPT2-S3,INV01,2,,,SDM-330-60P,17\nINV02-MPPT1-S3,INV02,1,,,Stringfield Demo Modules SDM-330-60P,18\n`;

describe('CSV layout import', () => {
  it('previews a good file without writing anything, then commits all rows', async () => {
    const before = await PvString.count({ where: { siteId: siteIds.CBD } });
    const preview = await upload(dispatcher, siteIds.CBD!, good, 'dry-run').expect(200);
    expect(preview.body).toMatchObject({ committed: false, totalRows: 3, validRows: 3, errorRows: 0 });
    expect(await PvString.count({ where: { siteId: siteIds.CBD } })).toBe(before);

    const done = await upload(dispatcher, siteIds.CBD!, good, 'commit').expect(201);
    expect(done.body.committed).toBe(true);
    expect(await PvString.count({ where: { siteId: siteIds.CBD } })).toBe(before + 3);
  });

  it('names each bad row and column, and a commit with errors writes nothing', async () => {
    const bad =
      `${header}` +
      'INV03-MPPT1-S9,INV03,1,,,SDM-999,18\n' + // unknown module model
      'INV03-MPPT1-S1,INV03,1,,,SDM-330-60P,18\n' + // label already at the site
      'INV03-MPPT2-S9,INV03,2,,,SDM-330-60P,eighteen\n' + // non-numeric count
      'INV03-MPPT2-S9,INV03,3,,,SDM-330-60P,18\n' + // duplicate label in the file, input 3 of 2
      'INV04-MPPT1-S9,INV04,1,,,SDM-330-60P,25\n' + // 25 × 40.6 V cold is far above 1000 V
      'INV04-MPPT1-S8,INV04,1,,,SDM-330-60P,18\n'; // fine
    const preview = await upload(dispatcher, siteIds.CBD!, bad, 'dry-run').expect(200);
    expect(preview.body).toMatchObject({ totalRows: 6, validRows: 1, errorRows: 5 });
    const rows = preview.body.rows as Array<{ line: number; errors: Array<{ column: string; message: string }> }>;
    const errorsOn = (line: number) => rows.find((r) => r.line === line)!.errors;
    expect(errorsOn(2)[0]).toMatchObject({ column: 'module_model', message: expect.stringMatching(/Unknown module model/) });
    expect(errorsOn(3)[0]).toMatchObject({ column: 'label', message: expect.stringMatching(/already exists/) });
    expect(errorsOn(4)[0]).toMatchObject({ column: 'modules_in_series', message: expect.stringMatching(/not a whole number/) });
    expect(errorsOn(5).map((e) => e.column).sort()).toEqual(['label', 'mppt_input']);
    expect(errorsOn(6)[0]).toMatchObject({ column: 'modules_in_series', message: expect.stringMatching(/1000/) });

    const before = await PvString.count();
    const res = await upload(dispatcher, siteIds.CBD!, bad, 'commit').expect(400);
    expect(errorOf(res).message).toMatch(/nothing was imported/);
    expect(res.body.preview.errorRows).toBe(5);
    expect(await PvString.count()).toBe(before);
  });

  it('reads semicolons, a byte-order mark, Windows line ends, blank lines and header case', async () => {
    const csv = '\uFEFFLabel;Inverter;MPPT Input;Module Model;Modules In Series\r\n\r\nINV05-MPPT1-S7;INV05;1;SDM-330-60P;18\r\n\r\n';
    const res = await upload(dispatcher, siteIds.CBD!, csv, 'dry-run').expect(200);
    expect(res.body).toMatchObject({ totalRows: 1, validRows: 1 });
  });

  it.each([
    ['missing columns', 'label,inverter\nX,INV01\n', /Missing column\(s\): mppt_input, module_model, modules_in_series/],
    ['text that is not UTF-8', Buffer.from(`${header}INV01-MPPT1-S5,INV01,1,,,SDM-330-60P,18,Gr\xfc\xdfe\n`, 'latin1'), /not UTF-8/],
    ['a binary file renamed .csv', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0, 0, 0, 0]), /binary/],
    ['an empty file', '', /empty/],
    ['a header without rows', header, /no rows/],
  ])('explains %s and imports nothing', async (_name, content, message) => {
    const before = await PvString.count();
    const res = await upload(dispatcher, siteIds.CBD!, content, 'dry-run').expect(200);
    expect(res.body.fileErrors[0]).toMatch(message);
    await upload(dispatcher, siteIds.CBD!, content, 'commit').expect(400);
    expect(await PvString.count()).toBe(before);
  });

  it('refuses a file over 10 MB with 413', async () => {
    const big = Buffer.alloc(11 * 1024 * 1024, 'a');
    const res = await upload(dispatcher, siteIds.CBD!, big, 'dry-run').expect(413);
    expect(errorOf(res).message).toMatch(/10 MB/);
  });

  it('refuses the import to a technician', async () => {
    await upload(tech, siteIds.CBD!, good, 'dry-run').expect(403);
  });
});
