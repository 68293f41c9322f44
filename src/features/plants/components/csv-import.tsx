import { useId, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { PLANT_CSV_COLUMNS, PLANT_CSV_HELP, PLANT_CSV_MAX_ROWS, PLANT_CSV_REQUIRED, type PlantCsvReport } from '../../../../shared/schemas/plants-csv';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { Button, ButtonLink } from '../../../components/ui/button';
import { Card, CardTitle } from '../../../components/ui/card';
import { Field, TextInput } from '../../../components/ui/field';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { errorMessage } from '../../../lib/api-client';
import { formatBytes, plural } from '../../../lib/format';
import { useImportPlants } from '../api/import-plants';
import type { Progress } from '../api/send-with-progress';
import { CsvReportTable } from './csv-report-table';
import { UploadProgress } from './upload-progress';

const MAX_BYTES = 5 * 1024 * 1024;

const TEMPLATE_HREF = `data:text/csv;charset=utf-8,${encodeURIComponent(`${PLANT_CSV_COLUMNS.join(',')}\r\n`)}`;

export function CsvColumns() {
  return (
    <TableShell caption="Columns of the plant CSV file" tableClassName="min-w-[36rem]">
      <thead>
        <tr>
          <th scope="col" className={`${th} w-48`}>
            Column
          </th>
          <th scope="col" className={th}>
            What to write
          </th>
        </tr>
      </thead>
      <tbody>
        {PLANT_CSV_COLUMNS.map((column) => (
          <tr key={column}>
            <td className={td}>
              <code className="rounded bg-paper-deep px-1.5 py-0.5 font-semibold">{column}</code>
              {PLANT_CSV_REQUIRED.includes(column) ? <span className="mt-1 block text-sm font-medium text-currant">required</span> : null}
            </td>
            <td className={td}>{PLANT_CSV_HELP[column]}</td>
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}

type Stage = { kind: 'idle' } | { kind: 'checked'; report: PlantCsvReport } | { kind: 'imported'; report: PlantCsvReport };

export function CsvImport() {
  const importer = useImportPlants();
  const fileRef = useRef<HTMLInputElement>(null);
  const formId = useId();
  const [file, setFile] = useState<{ name: string; size: number; text: string } | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const [stage, setStage] = useState<Stage>({ kind: 'idle' });
  const [progress, setProgress] = useState<Progress | null>(null);
  const [reading, setReading] = useState(false);

  const choose = async (chosen: File | undefined) => {
    setStage({ kind: 'idle' });
    importer.reset();
    setFile(null);
    setFileError(undefined);
    if (!chosen) return;
    if (chosen.size > MAX_BYTES) {
      setFileError(`File: ${formatBytes(chosen.size)} is more than the 5 MB limit. Split it into smaller files.`);
      return;
    }
    setReading(true);
    try {
      setFile({ name: chosen.name, size: chosen.size, text: await chosen.text() });
    } catch {
      setFileError('File: it could not be read. Save it again as CSV and choose it again.');
    } finally {
      setReading(false);
    }
  };

  const run = async (dryRun: boolean) => {
    if (!file) {
      setFileError('File: choose a CSV file first');
      return;
    }
    try {
      const report = await importer.mutateAsync({ csv: file.text, dryRun, onProgress: setProgress });
      const imported = !dryRun && report.errors.length === 0;
      setStage({ kind: imported ? 'imported' : 'checked', report });
      if (imported) {
        // The file is in the register now: sending it again would add every plant twice.
        setFile(null);
        if (fileRef.current) fileRef.current.value = '';
      }
    } catch {
      // Shown from the mutation below.
    } finally {
      setProgress(null);
    }
  };

  const report = stage.kind === 'idle' ? null : stage.report;
  const clean = report !== null && report.errors.length === 0;
  const badRows = report ? new Set(report.errors.map((e) => e.row)).size : 0;

  return (
    <div className="flex flex-col gap-5">
      <Card>
        <CardTitle>1. Choose the file</CardTitle>
        <p className="mb-4 text-ink-soft">
          A CSV file with a header row, as a spreadsheet saves it (comma-separated, UTF-8). Up to {PLANT_CSV_MAX_ROWS.toLocaleString('en-GB')} plants and
          5 MB at a time. Nothing is added until every row is right.
        </p>
        <form id={formId} onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-4">
          <Field label="File" error={fileError} hint={file ? `${file.name}, ${formatBytes(file.size)}` : undefined}>
            <TextInput ref={fileRef} type="file" accept=".csv,text/csv,text/plain" className="py-2" onChange={(event) => void choose(event.target.files?.[0])} />
          </Field>
          <div className="flex flex-wrap gap-2">
            <Button onClick={() => void run(true)} busy={importer.isPending && importer.variables?.dryRun === true} disabled={reading || importer.isPending}>
              Check the file
            </Button>
            <a className="inline-flex min-h-touch items-center px-2 font-medium" href={TEMPLATE_HREF} download="heelwood-plants-template.csv">
              Download a blank template
            </a>
          </div>
        </form>
      </Card>

      <UploadProgress progress={progress} noun="file" processingLabel={importer.variables?.dryRun ? 'Checking every row…' : 'Adding the plants…'} />
      {importer.isError ? <Alert tone="danger">{errorMessage(importer.error)}</Alert> : null}

      {stage.kind === 'imported' ? (
        <Alert tone="success" title={`${plural(stage.report.created, 'plant')} added to the register`}>
          <p>
            {stage.report.codes.length > 0 ? `Codes ${stage.report.codes[0]} to ${stage.report.codes[stage.report.codes.length - 1]}. ` : ''}
            <Link to={paths.plants()}>Go to the plant list</Link> or print labels for them from there.
          </p>
        </Alert>
      ) : null}

      {stage.kind === 'checked' && report ? (
        <Card>
          <CardTitle>2. What the check found</CardTitle>
          {clean ? (
            <Alert tone="success" title={`All ${plural(report.rows, 'row')} can be imported`}>
              {report.codes.length > 0 ? (
                <p>
                  They will get the codes {report.codes.slice(0, 6).join(', ')}
                  {report.codes.length > 6 ? ` and ${report.codes.length - 6} more` : ''}.
                </p>
              ) : null}
            </Alert>
          ) : (
            <Alert tone="danger" title={`${plural(badRows, 'row')} ${badRows === 1 ? 'has' : 'have'} problems; nothing was imported`}>
              Fix the rows below in your spreadsheet, save it as CSV again, choose it again and check it. Row numbers are as your spreadsheet shows them (the header is row 1).
            </Alert>
          )}
          {report.errors.length > 0 ? (
            <div className="mt-4">
              <h3 className="mb-2 font-semibold">Problems ({report.errors.length})</h3>
              <CsvReportTable problems={report.errors} caption="Problems in the file, by row and column" />
            </div>
          ) : null}
          {report.warnings.length > 0 ? (
            <div className="mt-4">
              <h3 className="mb-2 font-semibold">Notes ({report.warnings.length}): these values will not be used, but the import can go ahead</h3>
              <CsvReportTable problems={report.warnings} caption="Values in the file that will not be used" />
            </div>
          ) : null}
          {clean && report.rows > 0 ? (
            <div className="mt-5">
              <Button onClick={() => void run(false)} busy={importer.isPending && importer.variables?.dryRun === false} disabled={importer.isPending}>
                Import {plural(report.rows, 'plant')}
              </Button>
            </div>
          ) : null}
          {clean && report.rows === 0 ? <p className="mt-3 text-ink-soft">The file has a header but no plant rows. Add rows and check it again.</p> : null}
        </Card>
      ) : null}

      <Card>
        <CardTitle>The columns</CardTitle>
        <p className="mb-4 text-ink-soft">
          Columns may come in any order; their names are as below. An export from the plant list uses the same columns.
        </p>
        <CsvColumns />
        <div className="mt-4">
          <ButtonLink variant="secondary" to={paths.plants()}>
            Back to the plant list
          </ButtonLink>
        </div>
      </Card>
    </div>
  );
}
