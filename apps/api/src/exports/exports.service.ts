import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import type { NotebookExportFormat, TableExportFormat, UploadContent } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../members/notebook-policy.service';
import { NotebooksService } from '../notebooks/notebooks.service';
import { RunsService } from '../runs/runs.service';
import { UploadsService } from '../uploads/uploads.service';
import { latexWriter } from './latex-writer';
import { markdownWriter } from './markdown-writer';
import { renderNotebook } from './notebook-document';
import { siftNotebookFile } from './sift-writer';
import { asTable, toCsv, toJsonRows, type Table } from './table-export';

export interface ExportFile {
  fileName: string;
  mediaType: string;
  body: string;
}

const slug = (s: string): string => s.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) || 'notebook';

@Injectable()
export class ExportsService {
  constructor(
    private readonly notebooks: NotebooksService,
    private readonly runs: RunsService,
    private readonly uploads: UploadsService,
    private readonly audit: AuditService,
  ) {}

  async notebook(actor: Actor, id: string, format: NotebookExportFormat): Promise<ExportFile> {
    const nb = await this.notebooks.view(actor, id);
    const md = format === 'markdown';
    await this.audit.record(actor.id, `export.${format}`, id, { revision: nb.revision });
    if (format === 'sift') {
      return { fileName: `${slug(nb.title)}-r${nb.revision}.sift`, mediaType: 'text/plain; charset=utf-8', body: siftNotebookFile(nb) };
    }
    return {
      fileName: `${slug(nb.title)}-r${nb.revision}.${md ? 'md' : 'tex'}`,
      mediaType: md ? 'text/markdown; charset=utf-8' : 'application/x-latex; charset=utf-8',
      body: renderNotebook(nb, md ? markdownWriter : latexWriter),
    };
  }

  async runTable(runId: string, index: number, format: TableExportFormat): Promise<ExportFile> {
    const run = await this.runs.get(runId);
    const output = run.outputs?.[index];
    if (!output) throw new NotFoundException(`Run ${runId} has no output ${index}`);
    const table = asTable(output);
    if (!table) throw new BadRequestException({ message: `Output ${index} is a ${output.kind}, not a table`, details: { kind: output.kind } });
    return this.tableFile(`run-${runId.slice(0, 8)}-output-${index}`, table, format);
  }

  async uploadTable(uploadId: string, format: TableExportFormat): Promise<ExportFile> {
    const view = await this.uploads.get(uploadId);
    const content: UploadContent = await this.uploads.content(uploadId);
    const table: Table = content.kind === 'table' ? content : { columns: ['value'], rows: content.values.map((v) => [v]) };
    return this.tableFile(view.name, table, format);
  }

  private tableFile(base: string, table: Table, format: TableExportFormat): ExportFile {
    return format === 'csv'
      ? { fileName: `${base}.csv`, mediaType: 'text/csv; charset=utf-8', body: toCsv(table) }
      : { fileName: `${base}.json`, mediaType: 'application/json; charset=utf-8', body: JSON.stringify(toJsonRows(table), null, 2) };
  }
}
