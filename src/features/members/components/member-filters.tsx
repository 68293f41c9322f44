import { useState, type FormEvent } from 'react';
import { LABELS, type UserStatus } from '../../../../shared/domain';
import { Button } from '../../../components/ui/button';
import { TextInput } from '../../../components/ui/field';
import { cn } from '../../../lib/cn';

const TABS: Array<{ value: UserStatus | undefined; label: string }> = [
  { value: undefined, label: 'All' },
  { value: 'pending', label: LABELS.status.pending },
  { value: 'active', label: LABELS.status.active },
  { value: 'suspended', label: LABELS.status.suspended },
];

export function MemberFilters({
  status,
  q,
  onStatusChange,
  onSearch,
}: {
  status: UserStatus | undefined;
  q: string;
  onStatusChange: (status: UserStatus | undefined) => void;
  onSearch: (q: string) => void;
}) {
  // Keyed by the URL's q in the parent, so going back in history refills the box.
  const [draft, setDraft] = useState(q);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    onSearch(draft.trim());
  };

  return (
    <div className="mb-5 flex flex-col gap-4 lg:flex-row lg:items-end lg:justify-between">
      <div role="group" aria-label="Show members by status" className="flex flex-wrap gap-2">
        {TABS.map((tab) => {
          const selected = tab.value === status;
          return (
            <button
              key={tab.label}
              type="button"
              aria-pressed={selected}
              onClick={() => onStatusChange(tab.value)}
              className={cn(
                'min-h-touch rounded-full border-2 px-4 font-medium',
                selected ? 'border-currant bg-currant text-white' : 'border-paper-edge bg-white/60 text-ink hover:border-bark-light',
              )}
            >
              {tab.label}
            </button>
          );
        })}
      </div>
      <form role="search" onSubmit={submit} className="flex items-end gap-2">
        <div className="flex flex-col gap-1.5">
          <label htmlFor="member-search" className="font-medium">
            Search by name or e-mail
          </label>
          <TextInput id="member-search" type="search" value={draft} maxLength={100} onChange={(event) => setDraft(event.target.value)} className="sm:w-72" />
        </div>
        <Button type="submit" variant="secondary">
          Search
        </Button>
      </form>
    </div>
  );
}
