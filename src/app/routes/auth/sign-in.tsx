import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { safeNextPath } from '@/lib/safe-redirect';
import { PageLoading } from '@/components/ui/loading';
import { useMe } from '@/features/auth/api/get-me';
import { AuthFrame } from '@/features/auth/components/auth-frame';
import { SignInForm } from '@/features/auth/components/sign-in-form';

export function SignInPage() {
  const me = useMe();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const nextParam = params.get('next');
  const next = safeNextPath(nextParam);

  if (me.isPending) return <PageLoading label="Checking your session…" />;
  if (me.data) return <Navigate to={next} replace />;

  return (
    <AuthFrame title="Sign in" intro="Welcome back. Your gardens are waiting.">
      <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
      <p className="mt-4 text-sm">
        <Link to="/forgot-password" className="font-semibold text-frost underline">
          Forgot password?
        </Link>
      </p>
      <p className="mt-6 text-sm">
        New to Heatclock?{' '}
        <Link
          to={nextParam ? `/register?next=${encodeURIComponent(next)}` : '/register'}
          className="font-semibold text-frost underline"
        >
          Create an account
        </Link>
      </p>
    </AuthFrame>
  );
}
