// The fixed parts of a SpreadsheetML package (ECMA-376 Part 1 §18.2 workbook, §18.8 styles;
// Part 2 Open Packaging Conventions: content types, relationships, core properties).
import { xmlText } from './cell-xml.js';

const main = 'http://schemas.openxmlformats.org/spreadsheetml/2006/main';
const officeRels = 'http://schemas.openxmlformats.org/officeDocument/2006/relationships';
const packageRels = 'http://schemas.openxmlformats.org/package/2006/relationships';
const declaration = '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n';

const attr = (text: string) => xmlText(text).replace(/"/g, '&quot;');

/** Number formats by name, and the cell format (style index) each one gets in styles.xml. */
export const numberFormats = {
  dateTime: 'yyyy-mm-dd hh:mm:ss',
  date: 'yyyy-mm-dd',
  integer: '0',
  measured: '0.000###',
} as const;
export type NumberFormat = keyof typeof numberFormats;

/** Style indexes into cellXfs below: 0 plain, 1 bold header, then one per number format. */
export const headerStyle = 1;
export const formatStyle: Record<NumberFormat, number> = { dateTime: 2, date: 3, integer: 4, measured: 5 };

export const stylesXml = `${declaration}<styleSheet xmlns="${main}">`
  + '<numFmts count="3"><numFmt numFmtId="164" formatCode="yyyy-mm-dd hh:mm:ss"/><numFmt numFmtId="165" formatCode="yyyy-mm-dd"/>'
  + '<numFmt numFmtId="166" formatCode="0.000###"/></numFmts>'
  + '<fonts count="2"><font><sz val="11"/><name val="Calibri"/><family val="2"/></font>'
  + '<font><b/><sz val="11"/><name val="Calibri"/><family val="2"/></font></fonts>'
  + '<fills count="2"><fill><patternFill patternType="none"/></fill><fill><patternFill patternType="gray125"/></fill></fills>'
  + '<borders count="1"><border><left/><right/><top/><bottom/><diagonal/></border></borders>'
  + '<cellStyleXfs count="1"><xf numFmtId="0" fontId="0" fillId="0" borderId="0"/></cellStyleXfs>'
  + '<cellXfs count="6"><xf numFmtId="0" fontId="0" fillId="0" borderId="0" xfId="0"/>'
  + '<xf numFmtId="0" fontId="1" fillId="0" borderId="0" xfId="0" applyFont="1"/>'
  + '<xf numFmtId="164" fontId="0" fillId="0" borderId="0" xfId="0" applyNumberFormat="1"/>'
  + '<xf numFmtId="165" fontId="0" fillId="0" borderId="0" xfId="0" applyNumberFormat="1"/>'
  + '<xf numFmtId="1" fontId="0" fillId="0" borderId="0" xfId="0" applyNumberFormat="1"/>'
  + '<xf numFmtId="166" fontId="0" fillId="0" borderId="0" xfId="0" applyNumberFormat="1"/></cellXfs>'
  + '<cellStyles count="1"><cellStyle name="Normal" xfId="0" builtinId="0"/></cellStyles></styleSheet>';

export type SheetPart = { name: string; path: string };

/** [Content_Types].xml, the package and workbook relationships, workbook.xml and core.xml. */
export function packageParts(sheets: readonly SheetPart[], props: { creator: string; created: Date }): Array<[string, string]> {
  const sheetTypes = sheets.map((s) => `<Override PartName="/xl/${s.path}" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>`);
  const contentTypes = `${declaration}<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">`
    + '<Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/>'
    + '<Default Extension="xml" ContentType="application/xml"/>'
    + '<Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>'
    + '<Override PartName="/xl/styles.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.styles+xml"/>'
    + '<Override PartName="/docProps/core.xml" ContentType="application/vnd.openxmlformats-package.core-properties+xml"/>'
    + `${sheetTypes.join('')}</Types>`;
  const rootRels = `${declaration}<Relationships xmlns="${packageRels}">`
    + `<Relationship Id="rId1" Type="${officeRels}/officeDocument" Target="xl/workbook.xml"/>`
    + '<Relationship Id="rId2" Type="http://schemas.openxmlformats.org/package/2006/relationships/metadata/core-properties" Target="docProps/core.xml"/>'
    + '</Relationships>';
  const workbookRels = `${declaration}<Relationships xmlns="${packageRels}">`
    + sheets.map((s, i) => `<Relationship Id="rId${i + 1}" Type="${officeRels}/worksheet" Target="${s.path}"/>`).join('')
    + `<Relationship Id="rId${sheets.length + 1}" Type="${officeRels}/styles" Target="styles.xml"/></Relationships>`;
  const workbook = `${declaration}<workbook xmlns="${main}" xmlns:r="${officeRels}"><bookViews><workbookView activeTab="0"/></bookViews><sheets>`
    + sheets.map((s, i) => `<sheet name="${attr(s.name)}" sheetId="${i + 1}" r:id="rId${i + 1}"/>`).join('')
    + '</sheets></workbook>';
  const created = props.created.toISOString().replace(/\.\d{3}Z$/, 'Z');
  const core = `${declaration}<cp:coreProperties xmlns:cp="http://schemas.openxmlformats.org/package/2006/metadata/core-properties"`
    + ' xmlns:dc="http://purl.org/dc/elements/1.1/" xmlns:dcterms="http://purl.org/dc/terms/" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">'
    + `<dc:creator>${xmlText(props.creator)}</dc:creator><dcterms:created xsi:type="dcterms:W3CDTF">${created}</dcterms:created>`
    + '</cp:coreProperties>';
  return [
    ['[Content_Types].xml', contentTypes], ['_rels/.rels', rootRels], ['xl/workbook.xml', workbook],
    ['xl/_rels/workbook.xml.rels', workbookRels], ['xl/styles.xml', stylesXml], ['docProps/core.xml', core],
  ];
}
