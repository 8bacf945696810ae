import type { Role } from '../../../schema';

/**
 * The demo team: the process-data group of a fictional engineering firm, Kestrel Process Works.
 * One account per role; the fake GitHub offers exactly these, and the demo data gives each its role.
 */
export interface DemoAccount {
  githubId: number;
  login: string;
  name: string;
  email: string;
  role: Role;
}

export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  {
    githubId: 9_100_001,
    login: 'demo-reader',
    name: 'Tomas Reyes',
    email: 'tomas.reyes@kestrel.example',
    role: 'reader',
  },
  {
    githubId: 9_100_002,
    login: 'demo-curator',
    name: 'Priya Nandakumar',
    email: 'priya.n@kestrel.example',
    role: 'curator',
  },
  {
    githubId: 9_100_003,
    login: 'demo-editor',
    name: 'Helga Brandt',
    email: 'helga.brandt@kestrel.example',
    role: 'editor',
  },
  {
    githubId: 9_100_004,
    login: 'demo-editor-2',
    name: 'Kwame Mensah',
    email: 'kwame.mensah@kestrel.example',
    role: 'editor',
  },
  {
    githubId: 9_100_005,
    login: 'demo-admin',
    name: 'Lena Sørensen',
    email: 'lena.sorensen@kestrel.example',
    role: 'admin',
  },
];

export function findDemoAccount(login: string): DemoAccount | undefined {
  return DEMO_ACCOUNTS.find((a) => a.login === login);
}
