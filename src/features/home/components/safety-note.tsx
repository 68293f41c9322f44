import { Card, CardTitle } from '../../../components/ui/card';

const CAUTIONS: Array<{ title: string; body: string }> = [
  {
    title: 'Pruning tools',
    body: 'Keep blades sharp and clean and cut away from your body and your other hand. A clean blade also keeps disease from travelling between plants.',
  },
  {
    title: 'Rooting hormone',
    body: 'Wear gloves and follow the directions on the label. Keep it away from food, children and animals.',
  },
  {
    title: 'Kneeling work',
    body: 'Use knee pads or a kneeling mat in the beds and change position often.',
  },
  {
    title: 'Moving plant material',
    body: 'Some genera are restricted in some areas (currants and gooseberries near white pines, for example), and material that crosses a border needs phytosanitary papers. Check with your local plant-health authority before moving wood.',
  },
];

export function SafetyNote() {
  return (
    <Card as="aside" tone="caution" aria-labelledby="safety-note-title">
      <CardTitle>
        <span id="safety-note-title" className="inline-flex items-center gap-2">
          <svg width="18" height="18" viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="text-amber">
            <polygon points="10,1.5 19,18 1,18" fill="currentColor" />
            <rect x="9" y="7" width="2" height="6" fill="white" />
            <rect x="9" y="14.5" width="2" height="2" fill="white" />
          </svg>
          Working safely
        </span>
      </CardTitle>
      <ul className="flex flex-col gap-3">
        {CAUTIONS.map((caution) => (
          <li key={caution.title}>
            <p className="font-semibold">{caution.title}</p>
            <p className="text-ink-soft">{caution.body}</p>
          </li>
        ))}
      </ul>
      <p className="mt-4 text-sm text-ink-soft">
        Local plant-health rules and codes of practice come first. Heelwood advises and records; it does not certify plant health or
        permit any movement of plants.
      </p>
    </Card>
  );
}
