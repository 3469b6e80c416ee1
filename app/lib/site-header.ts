// What the site header shows a signed-in person (server/studio-header.server.ts fills it in;
// components/studio-header.tsx draws it).
export interface StudioHeaderData {
  user: { name: string; email: string };
  organisation: { id: number; name: string } | null;
  roles: string;
  steward: boolean;
  organisations: { id: number; name: string; roles: string }[];
  may: { member: boolean; team: boolean; editions: boolean; importEditions: boolean };
}
