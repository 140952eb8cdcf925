import { assetTypeTitles } from '../../../lib/assets';
import { useFirmFormat } from '../../../lib/format';
import type { KitWithMembersView } from '../../../../shared/assets/views';

/** The printable packing list: hidden on screen, the only thing printed from the kit page. */
export function PackingList({ kit, organizationName }: { kit: KitWithMembersView; organizationName: string }) {
  const { date } = useFirmFormat();
  const tick = <span aria-hidden="true" className="inline-block size-5 border-2 border-ink-900" />;
  return (
    <section aria-label="Packing list (printed)" className="hidden text-black print:block">
      <h2 className="text-2xl font-bold">Packing list · {kit.name}</h2>
      <p className="mb-4 text-sm">
        {organizationName} · {kit.members.length} {kit.members.length === 1 ? 'item' : 'items'} · printed {date(new Date())}
      </p>
      <table className="w-full border-collapse text-left text-sm">
        <thead>
          <tr className="border-b-2 border-black">
            <th className="py-1 pr-2">Asset tag</th>
            <th className="py-1 pr-2">Type</th>
            <th className="py-1 pr-2">Serial</th>
            <th className="py-1 pr-2">Model</th>
            <th className="w-16 py-1 text-center">Packed</th>
            <th className="w-16 py-1 text-center">Back</th>
          </tr>
        </thead>
        <tbody>
          {kit.members.map((m) => (
            <tr key={m.id} className="break-inside-avoid border-b border-black/40">
              <td className="py-2 pr-2 font-mono font-semibold whitespace-nowrap">{m.assetTag}</td>
              <td className="py-2 pr-2">{assetTypeTitles[m.type]}</td>
              <td className="py-2 pr-2 font-mono">{m.serialNumber}</td>
              <td className="py-2 pr-2">{m.model ?? ''}</td>
              <td className="py-2 text-center">{tick}</td>
              <td className="py-2 text-center">{tick}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-6 text-sm">Packed by ____________________ &nbsp; Checked by ____________________ &nbsp; Date __________</p>
      <p className="mt-3 text-xs">
        Tracker cases are heavy: lift with two people or use a trolley. Do not pack a dropped, swollen or damaged lithium-ion battery. Follow local codes, the
        carrier's rules and the instrument maker's instructions.
      </p>
    </section>
  );
}
