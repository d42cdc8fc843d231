import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'quiet';
const styles: Record<Variant, string> = {
  primary: 'bg-harbour text-white hover:bg-[#0c2c37] border-harbour',
  secondary: 'bg-card text-harbour border-harbour hover:bg-harbour-soft',
  danger: 'bg-alert text-white border-alert hover:bg-[#7f1b14]',
  quiet: 'bg-transparent text-harbour border-transparent hover:bg-harbour-soft',
};

export function Button({ variant = 'primary', className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      {...props}
      className={`inline-flex min-h-11 items-center justify-center gap-2 rounded-md border-2 px-4 py-2 font-bold transition-colors disabled:cursor-not-allowed disabled:opacity-60 ${styles[variant]} ${className}`}
    />
  );
}
