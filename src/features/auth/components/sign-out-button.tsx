import { LogOut } from 'lucide-react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { useLogout } from '@/features/auth/api/logout';

/** `className` sizes it for where it sits; every size keeps a 44 px tap target. */
export function SignOutButton({ className = 'px-3 text-sm' }: { className?: string }) {
  const logout = useLogout();
  const navigate = useNavigate();

  return (
    <Button
      variant="quiet"
      className={className}
      disabled={logout.isPending}
      onClick={() => logout.mutate(undefined, { onSuccess: () => void navigate('/sign-in', { replace: true }) })}
      title={logout.isError ? `Not signed out: ${logout.error.message}` : undefined}
    >
      <LogOut className="size-4" aria-hidden="true" />
      {logout.isError ? 'Sign out failed — try again' : 'Sign out'}
    </Button>
  );
}
