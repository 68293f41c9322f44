export type FarmSummary = {
  id: string;
  code: string;
  name: string;
  address: string;
  lat: number;
  lon: number;
  memberCount: number;
  plantCount: number;
};
