import type { PlantCsvProblem } from '../../../../shared/schemas/plants-csv';
import { TableShell, td, th } from '../../../components/ui/table-shell';

/** Beyond this many rows the table says how many more there are; fix these first. */
export const REPORT_ROWS_SHOWN = 500;

/** Problems in a CSV file, one per line: the spreadsheet row, the column, and why. */
export function CsvReportTable({ problems, caption }: { problems: PlantCsvProblem[]; caption: string }) {
  const sorted = [...problems].sort((a, b) => a.row - b.row || String(a.column ?? '').localeCompare(String(b.column ?? '')));
  const shown = sorted.slice(0, REPORT_ROWS_SHOWN);
  return (
    <div className="flex flex-col gap-2">
      <TableShell caption={caption} tableClassName="min-w-[32rem]">
        <thead>
          <tr>
            <th scope="col" className={`${th} w-20`}>
              Row
            </th>
            <th scope="col" className={`${th} w-44`}>
              Column
            </th>
            <th scope="col" className={th}>
              Why
            </th>
          </tr>
        </thead>
        <tbody>
          {shown.map((problem, index) => (
            <tr key={`${problem.row}-${problem.column ?? ''}-${index}`}>
              <td className={`${td} font-mono`}>{problem.row}</td>
              <td className={td}>{problem.column ? <code className="rounded bg-paper-deep px-1.5 py-0.5">{problem.column}</code> : <span className="text-ink-soft">whole row</span>}</td>
              <td className={td}>{problem.message}</td>
            </tr>
          ))}
        </tbody>
      </TableShell>
      {sorted.length > shown.length ? (
        <p className="text-ink-soft">
          And {sorted.length - shown.length} more. Fix these first and check the file again.
        </p>
      ) : null}
    </div>
  );
}
