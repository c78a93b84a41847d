/**
 * TEMPORARY STAND-IN for the Word and Excel builders, which are written apart
 * (`compliance-package.ts`, `compliance-workbook.ts`): the merge of those replaces the two
 * functions below with re-exports of theirs. These make a valid, small .docx and .xlsx from the
 * same input so that revisions, storage and downloads can be built and tested meanwhile; they are
 * not the submittal documents.
 */
import { Document, Footer, Packer, Paragraph, TextRun } from 'docx';
import ExcelJS from 'exceljs';
import type { PackageInput } from './package-input.js';

export async function buildCompliancePackage(input: PackageInput): Promise<Buffer> {
  const footer = `Fingerprint ${input.revision.fingerprint}${input.revision.draft ? ' · DRAFT — not for permit' : ''}`;
  const document = new Document({
    creator: 'Allowlight',
    title: `${input.project.name} — revision ${input.revision.number}`,
    sections: [
      {
        footers: { default: new Footer({ children: [new Paragraph({ children: [new TextRun(footer)] })] }) },
        children: [
          new Paragraph({ children: [new TextRun({ text: input.project.name, bold: true })] }),
          new Paragraph({ children: [new TextRun(`Submittal revision ${input.revision.number}`)] }),
        ],
      },
    ],
  });
  return Packer.toBuffer(document);
}

export async function buildComplianceWorkbook(input: PackageInput): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Allowlight';
  const sheet = workbook.addWorksheet('Summary');
  sheet.addRow(['Project', input.project.name]);
  sheet.addRow(['Revision', input.revision.number]);
  sheet.addRow(['Fingerprint', input.revision.fingerprint]);
  return Buffer.from(await workbook.xlsx.writeBuffer());
}
