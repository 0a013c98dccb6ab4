import { Dialog } from "@/components/ui/dialog";
import { GESTURES, SHORTCUTS } from "./shortcuts";

// The help sheet: the canvas's keys from the table it runs them from, then the pointer gestures.
export function ShortcutSheet({ open, onClose }: { open: boolean; onClose: () => void }) {
  return (
    <Dialog open={open} onClose={onClose} title="Keys of the drawing" wide>
      <table className="w-full text-sm">
        <tbody>
          {[...SHORTCUTS, ...GESTURES].map((k) => (
            <tr key={k.keys} className="border-b border-rule/70">
              <th scope="row" className="whitespace-nowrap py-1 pr-4 text-left font-mono text-xs font-medium">
                {k.keys}
              </th>
              <td className="py-1">{k.does}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-3 text-xs text-ink/60">Pick a kind in the palette, then click the grid to place it (Q and X turn and mirror it first; Shift+click places several).</p>
    </Dialog>
  );
}
