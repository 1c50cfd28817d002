import { useEffect, useId, useRef, useState, type FocusEvent } from 'react';
import { NavLink } from 'react-router-dom';
import { roleLabels } from '@shared/auth/permissions';
import type { SessionUserDto } from '@shared/schemas/auth';
import { paths } from '@/config/paths';

const items = [
  { to: paths.changePassword.href(), label: 'Change password' },
  { to: paths.about.href(), label: 'About Kcatalog' },
];

/**
 * The signed-in person's name and role, opening a short list of the pages about the account and the
 * program. A disclosure (a button and the links it shows) rather than an ARIA menu: the links stay plain
 * links, reached with Tab; Escape, a click elsewhere or moving focus away closes it.
 */
export function AccountMenu({ user }: { user: SessionUserDto }) {
  const [open, setOpen] = useState(false);
  const root = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const panelId = useId();

  useEffect(() => {
    if (!open) return;
    const handlePointerDown = (event: PointerEvent) => {
      if (!root.current?.contains(event.target as Node)) setOpen(false);
    };
    const handleKeyDown = (event: KeyboardEvent) => {
      if (event.key !== 'Escape') return;
      setOpen(false);
      button.current?.focus();
    };
    document.addEventListener('pointerdown', handlePointerDown);
    document.addEventListener('keydown', handleKeyDown);
    return () => {
      document.removeEventListener('pointerdown', handlePointerDown);
      document.removeEventListener('keydown', handleKeyDown);
    };
  }, [open]);

  const handleBlur = (event: FocusEvent<HTMLDivElement>) => {
    if (!root.current?.contains(event.relatedTarget as Node | null)) setOpen(false);
  };

  return (
    <div ref={root} className="relative" onBlur={handleBlur}>
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((wasOpen) => !wasOpen)}
        className="flex items-center gap-2 rounded-md px-2 py-1 text-sm hover:bg-lagoon-800"
      >
        <span className="sr-only">Account: </span>
        <span className="font-medium text-white">{user.name}</span>
        <span className="rounded bg-lagoon-700 px-1.5 py-0.5 text-xs uppercase tracking-wide text-lagoon-100">{roleLabels[user.role]}</span>
        <span aria-hidden className={`text-xs text-lagoon-100 transition-transform ${open ? 'rotate-180' : ''}`}>
          ▾
        </span>
      </button>
      <div
        id={panelId}
        hidden={!open}
        className="absolute right-0 top-full z-40 mt-2 w-52 rounded-md border border-paper-200 bg-white py-1 text-sm text-ink-900 shadow-card"
      >
        <ul>
          {items.map((item) => (
            <li key={item.to}>
              <NavLink
                to={item.to}
                onClick={() => setOpen(false)}
                className={({ isActive }) => `block px-3 py-2 hover:bg-paper-100 ${isActive ? 'font-semibold text-lagoon-700' : ''}`}
              >
                {item.label}
              </NavLink>
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}
