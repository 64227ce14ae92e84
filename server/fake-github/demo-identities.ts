/** A person as the GitHub-compatible provider describes them (`GET /user`). */
export interface FakeGithubIdentity {
  id: number;
  login: string;
  name: string;
  email: string;
}

/**
 * The structural-analysis team of Hallbrook & Vey, a fictional engineering firm: the people the
 * local fake provider offers on its sign-in screen, and the people the demo data is built around.
 * Every name, login, id and address here is invented.
 */
export const demoIdentities: readonly FakeGithubIdentity[] = [
  {
    id: 71_001,
    login: 'ines.okafor',
    name: 'Inês Okafor',
    email: 'ines.okafor@hallbrook-vey.example',
  },
  {
    id: 71_002,
    login: 'tomas.lindqvist',
    name: 'Tomas Lindqvist',
    email: 'tomas.lindqvist@hallbrook-vey.example',
  },
  {
    id: 71_003,
    login: 'priya.venkat',
    name: 'Priya Venkat',
    email: 'priya.venkat@hallbrook-vey.example',
  },
  {
    id: 71_004,
    login: 'mateo.achterberg',
    name: 'Mateo Achterberg',
    email: 'mateo.achterberg@hallbrook-vey.example',
  },
  {
    id: 71_005,
    login: 'yara.domsch',
    name: 'Yara Domsch',
    email: 'yara.domsch@hallbrook-vey.example',
  },
];
