/** The console's areas, in navigation order; each is a lazily loaded feature folder. */
export type AreaPath = 'runs' | 'specs' | 'uploads' | 'releases' | 'mailroom' | 'people' | 'audit';

export interface Area {
  readonly path: AreaPath;
  readonly label: string;
  /** A Material Symbols ligature name. */
  readonly icon: string;
  /** One sentence on what the area is for. */
  readonly purpose: string;
}

export const AREAS: readonly Area[] = [
  {
    path: 'runs',
    label: 'Runs',
    icon: 'monitoring',
    purpose: 'Inspect runs, compare them with the last released run of their spec, and rerun failures.',
  },
  {
    path: 'specs',
    label: 'Specs',
    icon: 'tune',
    purpose: 'Read and edit run specs and follow their revisions.',
  },
  {
    path: 'uploads',
    label: 'Uploads',
    icon: 'upload_file',
    purpose: 'Send price, market and risk-free files and follow the jobs they start.',
  },
  {
    path: 'releases',
    label: 'Releases',
    icon: 'verified',
    purpose: 'Release reviewed runs and see who received each report.',
  },
  {
    path: 'mailroom',
    label: 'Mailroom',
    icon: 'mail',
    purpose: 'Read the messages the server has sent to the local mail sink.',
  },
  {
    path: 'people',
    label: 'People',
    icon: 'group',
    purpose: 'Manage people, roles, machine tokens and distribution lists.',
  },
  {
    path: 'audit',
    label: 'Audit',
    icon: 'history',
    purpose: 'Trace who did what, and when, across specs, runs and releases.',
  },
];

export function areaByPath(path: AreaPath): Area {
  const area = AREAS.find((candidate) => candidate.path === path);
  if (area === undefined) {
    throw new Error(`No console area is registered under "${path}".`);
  }
  return area;
}
