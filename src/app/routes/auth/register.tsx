import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { safeNextPath } from '@/lib/safe-redirect';
import { PageLoading } from '@/components/ui/loading';
import { useMe } from '@/features/auth/api/get-me';
import { AuthFrame } from '@/features/auth/components/auth-frame';
import { RegisterForm } from '@/features/auth/components/register-form';

export function RegisterPage() {
  const me = useMe();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const nextParam = params.get('next');

  if (me.isPending) return <PageLoading label="Checking your session…" />;
  if (me.data) return <Navigate to={safeNextPath(nextParam)} replace />;

  return (
    <AuthFrame
      title="Create an account"
      intro="Start with one garden; you can set its location and units next."
    >
      <RegisterForm onRegistered={(garden) => navigate(`/g/${garden.id}`, { replace: true })} />
      <p className="mt-6 text-sm">
        Already have an account?{' '}
        <Link
          to={nextParam ? `/sign-in?next=${encodeURIComponent(safeNextPath(nextParam))}` : '/sign-in'}
          className="font-semibold text-frost underline"
        >
          Sign in
        </Link>
      </p>
    </AuthFrame>
  );
}
