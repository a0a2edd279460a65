import { parse } from 'csv-parse/sync';
import type { ImportPreview, SessionUser } from '@stringfield/shared';
import { requiredLayoutCsvColumns, tagSchema } from '@stringfield/shared';
import { AppError } from '../lib/app-error.ts';
import type { CreationAttributes } from 'sequelize';
import { CombinerBox, Inverter, InverterModel, ModuleModel, PvString, sequelize } from '../models/index.ts';
import { findVisibleSite } from './site-access.ts';
import { sizingChecks } from './sizing.service.ts';

export const MAX_IMPORT_ROWS = 20_000;
type Issue = { column: string; message: string };
type Row = ImportPreview['rows'][number];

const labelSchema = tagSchema('String label');

function normaliseHeader(h: string): string {
  return h.trim().toLowerCase().replace(/[\s-]+/g, '_');
}

function detectDelimiter(text: string): string {
  const firstLine = text.split(/\r?\n/).find((l) => l.trim().length > 0) ?? '';
  const counts = [';', ',', '\t'].map((d) => [d, firstLine.split(d).length - 1] as const);
  counts.sort((a, b) => b[1] - a[1]);
  return counts[0]![1] > 0 ? counts[0]![0] : ',';
}

function wholeNumber(value: string | undefined, column: string, min: number, max: number, issues: Issue[]): number | null {
  if (value === undefined || value === '') return null;
  if (!/^\d+$/.test(value)) {
    issues.push({ column, message: `"${value}" is not a whole number` });
    return null;
  }
  const n = Number(value);
  if (n < min || n > max) {
    issues.push({ column, message: `${n} is outside ${min}…${max}` });
    return null;
  }
  return n;
}

function emptyPreview(fileErrors: string[]): ImportPreview {
  return { committed: false, fileErrors, totalRows: 0, validRows: 0, errorRows: 0, warningRows: 0, rows: [] };
}

type Parsed = { record: Record<string, string>; line: number };

function parseCsv(buffer: Buffer): { rows: Parsed[]; fileErrors: string[] } {
  if (buffer.length === 0) return { rows: [], fileErrors: ['The file is empty.'] };
  if (buffer.includes(0)) return { rows: [], fileErrors: ['This is not a CSV text file (it contains binary data).'] };
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    return { rows: [], fileErrors: ['The file is not UTF-8 text. Save it again as "CSV UTF-8" and upload it once more.'] };
  }
  let records: Array<{ record: Record<string, string>; info: { lines: number } }>;
  try {
    const options = {
      bom: true,
      delimiter: detectDelimiter(text.replace(/^\uFEFF/, '')),
      columns: (header: string[]) => header.map(normaliseHeader),
      skip_empty_lines: true,
      skip_records_with_empty_values: true,
      trim: true,
      relax_column_count: true,
      info: true,
    } as const;
    // With `info: true` each record comes wrapped as { record, info } (csv-parse's typings do not say so).
    const parsed: unknown = parse(text, options);
    records = parsed as typeof records;
  } catch (err) {
    return { rows: [], fileErrors: [`The CSV could not be read: ${(err as Error).message}`] };
  }
  if (records.length === 0) return { rows: [], fileErrors: ['The file has a header but no rows.'] };
  const header = Object.keys(records[0]!.record);
  const missing = requiredLayoutCsvColumns.filter((c) => !header.includes(c));
  if (missing.length) {
    return {
      rows: [],
      fileErrors: [`Missing column(s): ${missing.join(', ')}. The first row must name: ${requiredLayoutCsvColumns.join(', ')} (combiner, position, strings_in_parallel are optional).`],
    };
  }
  if (records.length > MAX_IMPORT_ROWS) {
    return { rows: [], fileErrors: [`The file has ${records.length} rows; import at most ${MAX_IMPORT_ROWS} at a time.`] };
  }
  return { rows: records.map((r) => ({ record: r.record, line: r.info.lines })), fileErrors: [] };
}

/**
 * Check a layout CSV against the site (dry run) or import it: every row in one transaction, or none.
 */
export async function importLayout(user: SessionUser, siteId: number, buffer: Buffer, commit: boolean): Promise<ImportPreview> {
  const site = await findVisibleSite(user, siteId);
  const { rows: parsed, fileErrors } = parseCsv(buffer);
  if (fileErrors.length) {
    if (commit) throw new AppError('VALIDATION_FAILED', fileErrors[0]!, undefined, { preview: emptyPreview(fileErrors) });
    return emptyPreview(fileErrors);
  }

  const [inverters, boxes, modules, existing] = await Promise.all([
    Inverter.findAll({ where: { siteId, isArchived: false }, include: [{ model: InverterModel, as: 'inverterModel' }] }),
    CombinerBox.findAll({ where: { siteId, isArchived: false } }),
    ModuleModel.findAll({ where: { isArchived: false } }),
    PvString.findAll({ where: { siteId }, attributes: ['label'] }),
  ]);
  const inverterByTag = new Map(inverters.map((i) => [i.tag.toUpperCase(), i]));
  const boxByTag = new Map(boxes.map((b) => [b.tag.toUpperCase(), b]));
  const modulesByName = new Map<string, ModuleModel[]>();
  for (const m of modules) {
    for (const key of [m.model.toLowerCase(), `${m.maker} ${m.model}`.toLowerCase()]) {
      modulesByName.set(key, [...(modulesByName.get(key) ?? []), m]);
    }
  }
  const takenLabels = new Set(existing.map((s) => s.label.toUpperCase()));
  const seenLabels = new Map<string, number>();
  const sizingMemo = new Map<string, ReturnType<typeof sizingChecks>>();

  const toCreate: Array<CreationAttributes<PvString>> = [];
  const rows: Row[] = parsed.map(({ record, line }) => {
    const errors: Issue[] = [];
    const warnings: Issue[] = [];
    const v = (k: string) => record[k]?.trim() ?? '';

    const label = v('label');
    const labelCheck = labelSchema.safeParse(label);
    if (!labelCheck.success) errors.push({ column: 'label', message: labelCheck.error.issues[0]!.message });
    else if (takenLabels.has(label.toUpperCase())) errors.push({ column: 'label', message: `${label} already exists at this site` });
    else if (seenLabels.has(label.toUpperCase())) errors.push({ column: 'label', message: `${label} is also on line ${seenLabels.get(label.toUpperCase())}` });
    if (labelCheck.success) seenLabels.set(label.toUpperCase(), line);

    const inverter = inverterByTag.get(v('inverter').toUpperCase());
    if (!v('inverter')) errors.push({ column: 'inverter', message: 'Enter the inverter tag' });
    else if (!inverter) errors.push({ column: 'inverter', message: `No inverter ${v('inverter')} at ${site.code}; add it first` });

    const mppt = wholeNumber(v('mppt_input'), 'mppt_input', 1, 40, errors);
    if (v('mppt_input') === '') errors.push({ column: 'mppt_input', message: 'Enter the MPPT input number' });
    if (mppt && inverter && mppt > inverter.inverterModel!.mpptInputs) {
      errors.push({ column: 'mppt_input', message: `${inverter.tag} has only ${inverter.inverterModel!.mpptInputs} MPPT inputs` });
    }

    const boxTag = v('combiner');
    const box = boxTag ? boxByTag.get(boxTag.toUpperCase()) : undefined;
    if (boxTag && !box) errors.push({ column: 'combiner', message: `No combiner box ${boxTag} at ${site.code}` });
    const position = wholeNumber(v('position'), 'position', 1, 64, errors);

    const moduleName = v('module_model');
    const candidates = modulesByName.get(moduleName.toLowerCase()) ?? [];
    if (!moduleName) errors.push({ column: 'module_model', message: 'Enter the module model' });
    else if (candidates.length === 0) errors.push({ column: 'module_model', message: `Unknown module model "${moduleName}"; add it to the library first` });
    else if (candidates.length > 1) errors.push({ column: 'module_model', message: `"${moduleName}" matches several makers; write "maker model"` });
    const moduleModel = candidates.length === 1 ? candidates[0] : undefined;

    const series = wholeNumber(v('modules_in_series'), 'modules_in_series', 1, 60, errors);
    if (v('modules_in_series') === '') errors.push({ column: 'modules_in_series', message: 'Enter the number of modules in series' });
    const parallel = wholeNumber(v('strings_in_parallel'), 'strings_in_parallel', 1, 40, errors) ?? 1;

    if (inverter && moduleModel && series) {
      const key = `${moduleModel.id}|${inverter.inverterModelId}|${series}|${parallel}`;
      let checks = sizingMemo.get(key);
      if (!checks) {
        checks = sizingChecks({ moduleModel, inverterModel: inverter.inverterModel!, site, modulesInSeries: series, stringsInParallel: parallel });
        sizingMemo.set(key, checks);
      }
      for (const c of checks.filter((x) => !x.ok)) {
        // A string whose cold Voc exceeds the inverter's maximum DC voltage is unsafe to import as planned.
        (c.code === 'COLD_VOC_BELOW_MAX_DC' ? errors : warnings).push({ column: 'modules_in_series', message: c.message });
      }
    }

    if (errors.length === 0 && inverter && moduleModel && mppt && series) {
      toCreate.push({
        siteId,
        label,
        inverterId: inverter.id,
        mpptInput: mppt,
        combinerBoxId: box?.id ?? null,
        combinerPosition: position,
        moduleModelId: moduleModel.id,
        modulesInSeries: series,
        stringsInParallel: parallel,
        commissionedOn: null,
        notes: '',
      });
    }
    return { line, label, values: record, errors, warnings };
  });

  const preview: ImportPreview = {
    committed: false,
    fileErrors: [],
    totalRows: rows.length,
    validRows: rows.filter((r) => r.errors.length === 0).length,
    errorRows: rows.filter((r) => r.errors.length > 0).length,
    warningRows: rows.filter((r) => r.errors.length === 0 && r.warnings.length > 0).length,
    rows,
  };
  if (!commit) return preview;
  if (preview.errorRows > 0) {
    throw new AppError('VALIDATION_FAILED', `${preview.errorRows} row(s) have errors; nothing was imported. Fix them and try again.`, undefined, { preview });
  }
  await sequelize.transaction(async (transaction) => {
    for (let i = 0; i < toCreate.length; i += 1000) {
      await PvString.bulkCreate(toCreate.slice(i, i + 1000), { transaction });
    }
  });
  return { ...preview, committed: true };
}
