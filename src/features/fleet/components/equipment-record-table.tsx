import type { EquipmentRecordItem } from '../../../../shared/assets/views';
import { ScrollBox } from '../../../components/scroll-box';

/** The §6.4.13 items beside what Nestkeeper holds for each; gaps are said plainly. */
export function EquipmentRecordTable({ items }: { items: EquipmentRecordItem[] }) {
  return (
    <ScrollBox label="Equipment record items" className="rounded-lg border border-paper-line bg-card">
      <table className="w-full text-left">
        <caption className="sr-only">Equipment record items and what Nestkeeper holds</caption>
        <thead className="bg-paper-deep">
          <tr>
            <th scope="col" className="w-1/2 px-3 py-2 font-semibold">
              ISO/IEC 17025 §6.4.13 item
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              What Nestkeeper holds
            </th>
          </tr>
        </thead>
        <tbody>
          {items.map((item) => (
            <tr key={item.clause} className="border-t border-paper-line align-top">
              <th scope="row" className="px-3 py-2 font-normal">
                <span className="mr-2 font-mono text-sm text-ink-700">{item.clause}</span>
                {item.requirement}
              </th>
              <td className="px-3 py-2">
                {item.value ? <span className="whitespace-pre-line">{item.value}</span> : <span className="text-ink-500">Nothing recorded yet</span>}
                {item.note ? <p className="mt-1 text-sm text-ink-700">{item.note}</p> : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollBox>
  );
}
