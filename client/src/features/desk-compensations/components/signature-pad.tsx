import { useRef, useState, type PointerEvent } from 'react';
import { Button } from '../../../components/ui/button';

/**
 * The passenger signs on the desk's screen with a finger, a stylus or the mouse. The drawing is handed over as a PNG
 * data URL once there is a stroke; clearing hands over null.
 */
export function SignaturePad({ label, onChange }: { label: string; onChange: (png: string | null) => void }) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const drawing = useRef(false);
  const [signed, setSigned] = useState(false);

  const point = (e: PointerEvent<HTMLCanvasElement>) => {
    const box = e.currentTarget.getBoundingClientRect();
    return { x: ((e.clientX - box.left) * e.currentTarget.width) / box.width, y: ((e.clientY - box.top) * e.currentTarget.height) / box.height };
  };
  const start = (e: PointerEvent<HTMLCanvasElement>) => {
    const ctx = e.currentTarget.getContext('2d');
    if (!ctx) return;
    e.currentTarget.setPointerCapture(e.pointerId);
    drawing.current = true;
    const { x, y } = point(e);
    ctx.lineWidth = 3;
    ctx.lineCap = 'round';
    ctx.strokeStyle = '#111';
    ctx.beginPath();
    ctx.moveTo(x, y);
  };
  const move = (e: PointerEvent<HTMLCanvasElement>) => {
    if (!drawing.current) return;
    const ctx = e.currentTarget.getContext('2d');
    const { x, y } = point(e);
    ctx?.lineTo(x, y);
    ctx?.stroke();
  };
  const end = (e: PointerEvent<HTMLCanvasElement>) => {
    if (!drawing.current) return;
    drawing.current = false;
    setSigned(true);
    onChange(e.currentTarget.toDataURL('image/png'));
  };
  const clear = () => {
    const el = canvas.current;
    el?.getContext('2d')?.clearRect(0, 0, el.width, el.height);
    setSigned(false);
    onChange(null);
  };

  return (
    <div>
      <p className="font-bold">{label}</p>
      <canvas
        ref={canvas}
        width={600}
        height={160}
        data-testid="signature-pad"
        aria-label={`${label}: draw the signature here`}
        role="img"
        className="mt-1 h-40 w-full max-w-xl touch-none rounded-md border-2 border-dashed border-ink-soft bg-white"
        onPointerDown={start}
        onPointerMove={move}
        onPointerUp={end}
        onPointerLeave={end}
      />
      <div className="mt-1 flex items-center gap-3">
        <span className={signed ? 'font-bold text-calm' : 'text-ink-soft'}>{signed ? '✓ Signed' : 'Not signed yet'}</span>
        <Button variant="secondary" type="button" onClick={clear}>
          Clear the signature
        </Button>
      </div>
    </div>
  );
}
