import { Box } from '@mui/material';
import { DataGrid, type GridColDef } from '@mui/x-data-grid';
import { useMemo } from 'react';
import { monoFont } from '../../lib/design-tokens';
import type { TableOutput, ValueJson } from '../../lib/sift-output';
import { compareValues, valueText } from '../../lib/value-text';

type Row = { id: number } & Record<string, ValueJson | number>;

const NUMERIC = new Set(['int', 'rat', 'real']);
// Small tables render every row (browser find and printing see them all); large ones virtualise.
const RENDER_ALL_UP_TO = 200;
const AUTO_HEIGHT_UP_TO = 15;

/** A Sift table in the data grid: exact values, bigint-aware sorting, filter, CSV download of exact text. */
export function TableOutputView({ output, fileName }: { output: TableOutput; fileName?: string }) {
  const { columns, rows } = useMemo(() => {
    const cols: GridColDef<Row>[] = output.columns.map((name, i) => {
      const numeric = output.rows.length > 0 && output.rows.every((r) => r[i] && NUMERIC.has(r[i].t));
      return {
        field: `c${i}`,
        headerName: name,
        flex: 1,
        minWidth: 110,
        align: numeric ? 'right' : 'left',
        headerAlign: numeric ? 'right' : 'left',
        // The filter and the CSV see the exact text; the cell shows digits grouped.
        valueGetter: (_v, row) => valueText(row[`c${i}`] as ValueJson, { grouped: false }),
        renderCell: (p) => <span style={{ fontFamily: monoFont }}>{valueText(p.row[`c${i}`] as ValueJson)}</span>,
        getSortComparator: () => (_a, _b, p1, p2) =>
          compareValues(p1.api.getRow(p1.id)?.[`c${i}`] as ValueJson, p2.api.getRow(p2.id)?.[`c${i}`] as ValueJson),
      } satisfies GridColDef<Row>;
    });
    const data: Row[] = output.rows.map((r, id) => Object.fromEntries([['id', id], ...r.map((v, i) => [`c${i}`, v])]) as Row);
    return { columns: cols, rows: data };
  }, [output]);

  return (
    <Box>
      {/* Short tables take the height they need; long ones scroll inside a fixed frame. */}
      <Box sx={rows.length > AUTO_HEIGHT_UP_TO ? { height: 480 } : undefined}>
        <DataGrid
          rows={rows}
          columns={columns}
          density="compact"
          showToolbar
          disableRowSelectionOnClick
          disableVirtualization={rows.length <= RENDER_ALL_UP_TO}
          autoHeight={rows.length <= AUTO_HEIGHT_UP_TO}
          pageSizeOptions={[25, 100]}
          hideFooter={rows.length <= 25}
          initialState={{ pagination: { paginationModel: { pageSize: 100 } } }}
          slotProps={{ toolbar: { csvOptions: { fileName: fileName ?? output.label ?? 'cribra-table' }, printOptions: { disableToolbarButton: true } } }}
          label={output.label ?? 'Table'}
        />
      </Box>
      <Box sx={{ typography: 'caption', color: 'text.secondary', mt: 0.5 }}>
        {rows.length} row{rows.length === 1 ? '' : 's'}
      </Box>
    </Box>
  );
}
