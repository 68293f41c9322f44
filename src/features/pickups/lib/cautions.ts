// The slip's cautions come from the server as one list; on the page they read better in three
// short groups. A caution that fits no group goes with the handling advice.
export type CautionGroup = { title: string; items: string[] };

const SAFETY = /sharp|secateur|kneel|rooting hormone|gloves/i;
const RULES = /plant-health|phytosanitary|restricted|permit|\bban|quarantine|border|blister rust/i;

export function groupCautions(cautions: string[]): CautionGroup[] {
  const groups: CautionGroup[] = [
    { title: 'Keeping and sticking the cuttings', items: [] },
    { title: 'Your safety', items: [] },
    { title: 'Plant-health rules', items: [] },
  ];
  for (const c of cautions) {
    if (RULES.test(c)) groups[2].items.push(c);
    else if (SAFETY.test(c)) groups[1].items.push(c);
    else groups[0].items.push(c);
  }
  return groups.filter((g) => g.items.length > 0);
}
