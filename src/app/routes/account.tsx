import { PageHeader, Card } from '../../components/ui/card';
import { useMe } from '../../features/auth/api/get-me';
import { ChangePasswordForm } from '../../features/auth/components/change-password-form';
import { SessionList } from '../../features/auth/components/session-list';

/** The signed-in user's account: change the password, see and end their sessions. */
export default function AccountPage() {
  const user = useMe().data?.user;
  return (
    <>
      <PageHeader title="Account" subtitle={user ? `${user.name} · ${user.email}` : undefined} />
      <div className="grid gap-6 lg:grid-cols-2">
        <Card>
          <h2 className="mb-3">Change password</h2>
          <ChangePasswordForm />
        </Card>
        <Card>
          <h2 className="mb-1">Your sessions</h2>
          <p className="mb-3 text-sm text-ink-soft">Each browser you are signed in on. A session ends after 14 days without use, and at the latest a fixed time after signing in (30 days unless the site sets otherwise).</p>
          <SessionList />
        </Card>
      </div>
    </>
  );
}
