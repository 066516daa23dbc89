import type { EverydayProtocol } from '@/lib/publishing/types';

/** The protocol in everyday words, and what the load is for a few body weights. */
export function ProtocolPlain({ everyday }: { everyday: EverydayProtocol }) {
  return (
    <div className="space-y-4">
      <ul className="list-disc space-y-1 pl-5">
        {everyday.lines.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
      {everyday.loadTable && (
        <div className="overflow-x-auto">
          <table className="border-line w-full max-w-md border-collapse border text-left text-sm">
            <caption className="text-ink-muted mb-1 text-left text-sm">
              What the load is for a given body weight
            </caption>
            <thead className="bg-paper-sunken">
              <tr>
                <th scope="col" className="border-line border px-3 py-2">
                  Body weight
                </th>
                <th scope="col" className="border-line border px-3 py-2">
                  Total load
                </th>
                <th scope="col" className="border-line border px-3 py-2">
                  Added (−: taken off)
                </th>
              </tr>
            </thead>
            <tbody>
              {everyday.loadTable.map((row) => (
                <tr key={row.bodyweightKg}>
                  <th scope="row" className="border-line border px-3 py-2 font-semibold">
                    {row.bodyweightKg} kg
                  </th>
                  <td className="border-line border px-3 py-2">{row.totalKg} kg</td>
                  <td className="border-line border px-3 py-2">
                    {row.addedKg > 0 ? '+' : row.addedKg < 0 ? '−' : ''}
                    {Math.abs(row.addedKg)} kg
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {everyday.loadTableNote && (
            <p className="text-ink-muted mt-2 max-w-prose text-sm">{everyday.loadTableNote}</p>
          )}
        </div>
      )}
    </div>
  );
}
