import type { ButtonHTMLAttributes } from 'react';

/** A button a thumb finds at arm's length. */
export function BigButton({ className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement>) {
  return (
    <button
      {...props}
      className={`min-h-16 w-full rounded-xl border-4 border-harbour bg-harbour px-5 py-3 text-2xl font-bold text-white hover:bg-[#0c2c37] disabled:cursor-not-allowed disabled:opacity-60 ${className}`}
    />
  );
}
