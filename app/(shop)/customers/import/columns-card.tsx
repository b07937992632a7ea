import { Card } from '@/components/ui/card';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';

/** The import's columns with what each takes, beside a link to the template. */
export function ColumnsCard({ kind, columns }: { kind: string; columns: readonly { column: string; required: boolean; example: string; hint: string }[] }) {
  return (
    <Card title="Columns" description={<a href={`/api/imports/${kind}/template`}>Download the template CSV</a>} padding="none">
      <Table caption="Columns" captionHidden dense>
        <THead>
          <Tr>
            <Th>Column</Th>
            <Th>Required</Th>
            <Th>Example</Th>
            <Th>Notes</Th>
          </Tr>
        </THead>
        <TBody>
          {columns.map((c) => (
            <Tr key={c.column}>
              <Td className="font-mono">{c.column}</Td>
              <Td>{c.required ? 'yes' : ''}</Td>
              <Td>{c.example}</Td>
              <Td className="text-ink-muted">{c.hint}</Td>
            </Tr>
          ))}
        </TBody>
      </Table>
    </Card>
  );
}
