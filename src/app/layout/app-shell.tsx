import { useQueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { NavLink, useNavigate } from 'react-router-dom';
import { can, ROLE_LABELS } from '#shared/auth/roles.ts';
import type { SessionUser } from '#shared/schemas/auth.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { paths } from '@/config/paths.ts';
import { useSignOut } from '@/features/auth/api/sign-out.ts';
import { plural } from '@/lib/plural.ts';
import mark from '@/assets/loomwright-mark.svg';

function NavItem({ to, children }: { to: string; children: ReactNode }) {
  return (
    <NavLink
      to={to}
      className={({ isActive }) =>
        `rounded-md px-3 py-1.5 text-[0.9375rem] font-medium ${
          isActive ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-sunk hover:text-ink'
        }`
      }
    >
      {children}
    </NavLink>
  );
}

export function AppShell({ user, children }: { user: SessionUser; children: ReactNode }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-paper-raised print:hidden">
        <div className="mx-auto flex max-w-[1400px] flex-wrap items-center gap-x-6 gap-y-2 px-5 py-3">
          <a href={paths.home.getHref()} className="flex items-center gap-2.5">
            <img src={mark} alt="" className="size-8" />
            <span className="leading-tight">
              <span className="block text-lg font-bold tracking-tight">Loomwright</span>
              <span className="block text-xs text-ink-faint">{user.workshopName}</span>
            </span>
          </a>
          <nav aria-label="Main" className="flex flex-wrap gap-1">
            <NavItem to={paths.conversions.getHref()}>Conversions</NavItem>
            <NavItem to={paths.library.getHref()}>Pinout library</NavItem>
            <NavItem to={paths.calculator.getHref()}>Calculator</NavItem>
            {can(user.role, 'users:manage') ? (
              <NavItem to={paths.users.getHref()}>People</NavItem>
            ) : null}
            {can(user.role, 'workshop:settings') ? (
              <NavItem to={paths.settings.getHref()}>Workshop settings</NavItem>
            ) : null}
            {can(user.role, 'outbox:read') ? (
              <NavItem to={paths.outbox.getHref()}>Mail</NavItem>
            ) : null}
          </nav>
          <div className="ml-auto flex items-center gap-3">
            <NavItem to={paths.help.getHref()}>Help</NavItem>
            <NavLink
              to={paths.account.getHref()}
              className="text-right leading-tight hover:underline"
            >
              <span className="block text-sm font-semibold">{user.name}</span>
              <span className="block text-xs text-ink-faint">{ROLE_LABELS[user.role]}</span>
            </NavLink>
            <Button
              size="sm"
              variant="secondary"
              busy={signOut.isPending}
              onClick={() => {
                // Signing out clears the tablet's queue: ticks made offline would be lost unsaid.
                const unsent = queryClient
                  .getMutationCache()
                  .getAll()
                  .filter((m) => m.state.isPaused).length;
                if (
                  unsent > 0 &&
                  !window.confirm(
                    `${plural(unsent, 'change')} made offline ${unsent === 1 ? 'has' : 'have'} not reached the server yet. Signing out now throws ${unsent === 1 ? 'it' : 'them'} away. Sign out anyway?`,
                  )
                ) {
                  return;
                }
                signOut.mutate(undefined, { onSettled: () => navigate(paths.signIn.getHref()) });
              }}
            >
              Sign out
            </Button>
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-[1400px] px-5 py-6">{children}</main>
      <footer className="mx-auto max-w-[1400px] px-5 pb-8 text-xs text-ink-faint">
        Loomwright checks are an aid, not a licence: local codes and licensed practice prevail.
      </footer>
    </div>
  );
}
