import type { ApiErrorDetail } from '../core/http/api-error';

/** A page of the project workspace, and what it should open: the space or item to fix. */
export interface WorkspaceLink {
  page: 'setup' | 'spaces' | 'luminaires' | 'controls' | 'daylight' | 'exterior';
  query?: Record<string, string>;
}

/** A problem the service reported, in words: what it is about, which field, what to do, and where. */
export interface ProblemLine {
  /** The space, luminaire type or application it is about ("Reading room"); null for the project. */
  subject: string | null;
  /** The field's label ("Floor area"); null when the problem is about the whole item. */
  field: string | null;
  message: string;
  link: WorkspaceLink | null;
}

/**
 * What a problem's path refers to, in the order the evaluated document lists them (spaces with
 * their ids, luminaire types by tag, exterior applications with their names).
 */
export interface ProblemContext {
  spaces?: readonly { id: string; name: string }[];
  luminaireTags?: readonly string[];
  exteriorApplications?: readonly { label: string }[];
}

const spaceFields: Record<string, string> = {
  id: 'Space',
  name: 'Name',
  level: 'Level',
  spaceType: 'Space type',
  buildingAreaType: 'Building area type',
  controlSpaceType: 'Control space type',
  area: 'Floor area',
  ceilingHeight: 'Ceiling height',
  length: 'Room length',
  width: 'Room width',
  luminaireHeight: 'Luminaire height',
  workPlaneHeight: 'Work-plane height',
  enclosed: 'Enclosed',
  unlit: 'Confirmed unlit',
  luminaires: 'Luminaire counts',
  controls: 'Controls',
  windows: 'Windows',
  skylights: 'Skylights',
};

const openingFields: Record<string, string> = {
  width: 'width',
  headHeight: 'head height',
  sillHeight: 'sill height',
  wall: 'wall',
  offset: 'position along the wall',
  length: 'length',
  x: 'position along the room',
  y: 'position across the room',
};

const controlFields: Record<string, string> = {
  strategy: 'control',
  provided: 'provided',
  timeoutMinutes: 'time-out',
  zoneSize: 'zone size',
  autoOn: 'turns on',
  device: 'device',
  exceptionReason: 'exception',
  exceptionNote: 'exception note',
};

const luminaireFields: Record<string, string> = {
  tag: 'Type tag',
  description: 'Description',
  inputWatts: 'Rated input watts',
  use: 'Use',
  exemptReason: 'Exemption reason',
  basis: 'Wattage basis',
  length: 'Track length',
  limitWatts: 'Limiter or transformer rating',
  wattageSource: 'Where the wattage comes from',
};

const exteriorFields: Record<string, string> = {
  key: 'Application',
  description: 'Description',
  quantity: 'Quantity',
  installedWatts: 'Installed watts',
  controls: 'Controls',
};

const setupFields: Record<string, string> = {
  edition: 'Code edition',
  method: 'Compliance method',
  units: 'Units',
  lightingZone: 'Exterior lighting zone',
  'exterior.lightingZone': 'Exterior lighting zone',
};

const ordinal = (index: string) => String(Number(index) + 1);

/** The words of a control's field: "Controls: time-out". */
function controlField(rest: string[]): string {
  const field = rest[1] ? controlFields[rest[1]] : undefined;
  return field ? `Controls: ${field}` : 'Controls';
}

/**
 * A code-table key the service quoted ("walkways-less-than-10-feet-wide") read as words; a key is
 * what a stored value keeps when it is not in the edition, so there is no label to give instead.
 */
const keyWords: Record<string, string> = { lt: 'less than', gt: 'greater than', le: 'at most', ge: 'at least' };

function keysInWords(message: string): string {
  return message.replace(/[“"]([a-z0-9]+(?:-[a-z0-9]+)+)[”"]/g, (_match, key: string) => {
    const words = key
      .split('-')
      .map((part) => keyWords[part] ?? part)
      .join(' ');
    return `“${words[0]!.toUpperCase()}${words.slice(1)}”`;
  });
}

function spaceLine(index: string, rest: string[], message: string, context: ProblemContext): ProblemLine {
  const space = context.spaces?.[Number(index)];
  const subject = space?.name ?? `Space ${ordinal(index)}`;
  const id = space?.id;
  const [field, item, sub] = rest;
  const query = (extra: Record<string, string> = {}) => (id ? { space: id, ...extra } : undefined);
  if (field === 'windows' || field === 'skylights') {
    const kind = field === 'windows' ? 'Window' : 'Skylight';
    const detail = sub ? openingFields[sub] : undefined;
    return {
      subject,
      field: item === undefined ? spaceFields[field]! : `${kind} ${ordinal(item)}${detail ? `: ${detail}` : ''}`,
      message,
      link: { page: 'daylight', query: query() },
    };
  }
  if (field === 'controls') return { subject, field: controlField(rest.slice(1)), message, link: { page: 'controls', query: query() } };
  if (field === 'luminaires') {
    const what = sub === 'zone' ? 'Luminaire counts: daylight zone' : 'Luminaire counts';
    return { subject, field: what, message, link: { page: 'luminaires', query: query() } };
  }
  const label = field === undefined ? null : (spaceFields[field] ?? null);
  return { subject, field: label, message, link: { page: 'spaces', query: query(field && spaceFields[field] ? { field } : {}) } };
}

/**
 * One service problem (`spaces.3.area`, `exterior.applications.2.key`, `luminaireTypes.0.tag`, or a
 * write's own field) in words, with the page where it is fixed. No path, key or field name is left
 * for a person to decode. Paths are read against the evaluated document's order in `context`.
 */
export function problemLine(detail: ApiErrorDetail, context: ProblemContext = {}): ProblemLine {
  const message = keysInWords(detail.message);
  const parts = detail.path === '' ? [] : detail.path.split('.');
  const [head, index, ...rest] = parts;
  if (head === 'spaces' && index !== undefined && /^\d+$/.test(index)) return spaceLine(index, rest, message, context);
  if (head === 'luminaireTypes' && index !== undefined && /^\d+$/.test(index)) {
    const tag = context.luminaireTags?.[Number(index)];
    return {
      subject: tag ? `Luminaire type ${tag}` : `Luminaire type ${ordinal(index)}`,
      field: rest[0] ? (luminaireFields[rest[0]] ?? null) : null,
      message,
      link: { page: 'luminaires' },
    };
  }
  if (head === 'exterior' && index === 'applications' && rest[0] !== undefined) {
    const application = context.exteriorApplications?.[Number(rest[0])];
    const field = rest[1] === 'controls' ? controlField(rest.slice(2)) : rest[1] ? (exteriorFields[rest[1]] ?? null) : null;
    return { subject: application?.label ?? `Exterior application ${ordinal(rest[0])}`, field, message, link: { page: 'exterior' } };
  }
  if (head === 'retailDisplay') return { subject: 'Additional allowances', field: null, message, link: { page: 'spaces' } };
  const setup = setupFields[detail.path];
  if (setup) return { subject: null, field: setup, message, link: { page: 'setup' } };
  // A write's own fields (a space or control saved on its own): the field in words, no link.
  if (head === 'controls') return { subject: null, field: controlField(parts.slice(1)), message, link: null };
  const field = head === undefined ? null : (spaceFields[head] ?? luminaireFields[head] ?? exteriorFields[head] ?? null);
  return { subject: null, field, message, link: null };
}

/** A problem as one sentence, for a snackbar or a screen reader: "Reading room — Floor area: Out of range…". */
export function problemText(line: ProblemLine): string {
  const where = [line.subject, line.field].filter(Boolean).join(' — ');
  return where ? `${where}: ${line.message}` : line.message;
}
