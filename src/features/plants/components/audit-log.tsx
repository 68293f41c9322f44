import { LABELS, type HealthStatus, type PlantRole } from '../../../../shared/domain';
import type { AuditItem } from '../../../../shared/schemas/register';
import { formatDateTime } from '../../../lib/format';

const FIELD_WORDS: Record<string, string> = {
  speciesId: 'species',
  varietyId: 'variety',
  plantingYear: 'planting year',
  provenance: 'provenance',
  parentPlantId: 'parent plant',
  supplier: 'supplier',
  lat: 'position',
  lon: 'position',
  bedRow: 'bed/row',
  notes: 'notes',
  code: 'code',
};

function get<T>(value: unknown, key: string): T | undefined {
  return value && typeof value === 'object' && key in value ? ((value as Record<string, unknown>)[key] as T) : undefined;
}

function health(value: unknown): string {
  const status = get<HealthStatus>(value, 'healthStatus');
  return status && status in LABELS.health ? LABELS.health[status] : '?';
}

/** One audit row in words: what changed. */
export function describeAudit(item: AuditItem, farmName: (id: string) => string | undefined): string {
  switch (item.action) {
    case 'create':
      return 'Added to the register';
    case 'role': {
      const from = get<PlantRole>(item.before, 'role');
      const to = get<PlantRole>(item.after, 'role');
      return `Role changed${from ? ` from ${LABELS.plantRole[from]}` : ''}${to ? ` to ${LABELS.plantRole[to]}` : ''}`;
    }
    case 'transfer': {
      const from = get<string>(item.before, 'farmId');
      const to = get<string>(item.after, 'farmId');
      const fromName = from ? farmName(from) : undefined;
      const toName = to ? farmName(to) : undefined;
      return `Moved to another farm${fromName ? ` from ${fromName}` : ''}${toName ? ` to ${toName}` : ''}`;
    }
    case 'status':
      return `Health status: ${health(item.before)} → ${health(item.after)}`;
    case 'lift_hold':
      return `Hold lifted: now ${health(item.after)}`;
    case 'edit': {
      const fields = get<string[]>(item.after, 'fields') ?? [];
      const words = [...new Set(fields.map((f) => FIELD_WORDS[f] ?? f))];
      return words.length ? `Edited: ${words.join(', ')}` : 'Edited';
    }
    default:
      return item.action.replace(/_/g, ' ');
  }
}

export function AuditLog({ items, farmName }: { items: AuditItem[]; farmName: (id: string) => string | undefined }) {
  if (items.length === 0) return <p className="text-ink-soft">No changes recorded yet.</p>;
  return (
    <ol className="flex flex-col divide-y divide-paper-edge">
      {items.map((item) => (
        <li key={item.id} className="flex flex-col gap-0.5 py-3">
          <p className="font-medium">{describeAudit(item, farmName)}</p>
          <p className="text-sm text-ink-soft">
            <time dateTime={item.at}>{formatDateTime(item.at)}</time> · {item.actorName ?? 'Heelwood'}
          </p>
          {item.reason ? (
            <p className="text-sm">
              <span className="font-semibold">Why: </span>
              {item.reason}
            </p>
          ) : null}
        </li>
      ))}
    </ol>
  );
}
