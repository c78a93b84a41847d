import { AlignmentType, Document, HeadingLevel, ImageRun, Packer, Paragraph, TextRun, type FileChild } from 'docx';
import type { FieldTestRecord, TestPlanView } from '../../../contract/field-tests.js';
import type { FieldTestPhoto } from '../../../contract/field-tests.js';

/** The most photos one record carries, the most recent first. */
export const recordPhotoLimit = 200;

export interface RecordInput {
  project: { name: string; address: string | null; edition: string };
  plan: TestPlanView;
  /** The package's cautions, in the package's words (`packageCautions`). */
  cautions: string[];
  photos: { total: number; photos: (FieldTestPhoto & { itemId: string; data: Buffer; type: 'jpg' | 'png' })[] };
  madeAt: Date;
}

const heading = (text: string, level: 1 | 2 | 3 = 1) =>
  new Paragraph({ text, heading: level === 1 ? HeadingLevel.HEADING_1 : level === 2 ? HeadingLevel.HEADING_2 : HeadingLevel.HEADING_3 });
const line = (text: string) => new Paragraph({ children: [new TextRun(text)] });
const labelled = (label: string, value: string) =>
  new Paragraph({ children: [new TextRun({ text: `${label}: `, bold: true }), new TextRun(value)] });
const bullet = (text: string) => new Paragraph({ text, bullet: { level: 0 } });

const day = (iso: string) => iso.slice(0, 10);

function resultWords(record: FieldTestRecord | undefined): string {
  if (!record) return 'Not tested yet';
  return record.result === 'pass' ? 'Passed' : 'Failed';
}

function measuredWords(record: FieldTestRecord): string {
  const parts: string[] = [];
  if (record.measured.timeoutMinutes !== undefined) parts.push(`time-out ${record.measured.timeoutMinutes} minutes`);
  if (record.measured.lightLevel !== undefined)
    parts.push(`light level ${record.measured.lightLevel} ${record.lightLevelUnit === 'lux' ? 'lux' : 'foot-candles'}`);
  if (record.measured.overrideMinutes !== undefined) parts.push(`override ${record.measured.overrideMinutes} minutes`);
  return parts.join(', ');
}

function testLine(record: FieldTestRecord): string {
  const measured = measuredWords(record);
  return [
    `${resultWords(record)} on ${day(record.at)}`,
    record.by ? `by ${record.by.name}` : '',
    measured ? `— ${measured}` : '',
    record.notes ? `— ${record.notes}` : '',
  ]
    .filter(Boolean)
    .join(' ');
}

/** The closeout record of the field tests as a Word document: cover, samples, items, photos, cautions, signatures. */
export async function fieldTestRecordDocx(input: RecordInput): Promise<Buffer> {
  const { plan, project } = input;
  const records = plan.items.flatMap((item) => item.history);
  const testers = [...new Set(records.map((record) => record.by?.name).filter((name): name is string => Boolean(name)))];
  const dates = records.map((record) => day(record.at)).sort();
  const overall = plan.progress.complete
    ? 'Complete: every required test passed.'
    : `Not complete: ${plan.progress.passed} of ${plan.progress.required} required tests passed, ${plan.progress.failed} failed, ${plan.progress.untested} not tested yet.`;
  const cover: FileChild[] = [
    new Paragraph({ text: 'Field test record', heading: HeadingLevel.TITLE }),
    labelled('Project', project.name),
    labelled('Address', project.address ?? 'Not given'),
    labelled('Code edition', project.edition),
    labelled('Tested by', testers.length ? testers.join(', ') : 'No test recorded yet'),
    labelled('Test dates', dates.length ? `${dates[0]} to ${dates[dates.length - 1]}` : 'No test recorded yet'),
    labelled('Overall result', overall),
    labelled('Record made', day(input.madeAt.toISOString())),
  ];
  const notices = plan.notices.length ? [heading('Notices'), ...plan.notices.map(bullet)] : [];
  const samples: FileChild[] = [
    heading('Samples tested'),
    ...plan.groups.flatMap((group) => [heading(group.combination, 3), line(group.words)]),
  ];
  const photosByItem = new Map<string, RecordInput['photos']['photos']>();
  for (const photo of input.photos.photos) photosByItem.set(photo.itemId, [...(photosByItem.get(photo.itemId) ?? []), photo]);
  const items: FileChild[] = [heading('Tests')];
  for (const item of plan.items) {
    items.push(heading(item.title, 2));
    items.push(labelled('Result', resultWords(item.result)));
    items.push(labelled('Required', item.required ? 'Yes' : 'No, outside the sample'));
    items.push(labelled('Expected', item.expected));
    items.push(labelled('Section', item.section));
    if (item.result) {
      const measured = measuredWords(item.result);
      if (measured) items.push(labelled('Measured', measured));
      if (item.result.notes) items.push(labelled('Notes', item.result.notes));
    }
    if (item.history.length > 1) {
      items.push(heading('Test history', 3));
      items.push(...item.history.map((record) => bullet(testLine(record))));
    }
    for (const photo of photosByItem.get(item.id) ?? []) {
      const scale = Math.min(1, 450 / photo.width, 450 / photo.height);
      items.push(
        new Paragraph({
          alignment: AlignmentType.LEFT,
          children: [
            new ImageRun({
              type: photo.type,
              data: photo.data,
              transformation: { width: Math.round(photo.width * scale), height: Math.round(photo.height * scale) },
            }),
          ],
        }),
        line(`${photo.caption ?? 'Photo of this test'} — ${day(photo.at)}${photo.by ? `, ${photo.by.name}` : ''}`),
      );
    }
  }
  const capped =
    input.photos.total > input.photos.photos.length
      ? [
          line(
            `This record shows the ${input.photos.photos.length} most recent of the ${input.photos.total} photos; the others stay in the project.`,
          ),
        ]
      : [];
  const cautions = [heading('Cautions'), ...(input.cautions.length ? input.cautions.map(bullet) : [line('None.')])];
  const signature = (role: string) => [
    line(''),
    line(`${role}: ______________________________   Date: ____________`),
    line('Name: ______________________________'),
  ];
  const signatures = [
    heading('Signatures'),
    ...signature('Contractor'),
    ...signature('Commissioning agent'),
    ...signature('Owner’s representative'),
  ];
  const document = new Document({
    creator: 'Field test record',
    title: `Field test record — ${project.name}`,
    sections: [{ children: [...cover, ...notices, ...samples, ...items, ...capped, ...cautions, ...signatures] }],
  });
  return Packer.toBuffer(document);
}
