import type { ReactNode } from 'react';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { EmailChangeForm } from '@/features/auth/components/email-change-form';
import { PasswordChangeForm } from '@/features/auth/components/password-change-form';
import { ProfileNameForm } from '@/features/auth/components/profile-name-form';

function ProfileSection({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="rounded-card border border-rule bg-sheet p-5 shadow-card sm:p-6">
      <h2 id={id} className="mb-4 text-h3">
        {title}
      </h2>
      {children}
    </section>
  );
}

export default function ProfileRoute() {
  // The account layout shows this page only once the session is known.
  const user = useCurrentUser().data;
  if (!user) return null;

  return (
    <>
      <PageTitle title="Profile" />
      <PageHeader title="Profile" lead="Your name, the e-mail address you sign in with, and your password." />
      <div className="grid max-w-xl gap-6">
        <ProfileSection id="profile-name" title="Name">
          <ProfileNameForm user={user} />
        </ProfileSection>
        <ProfileSection id="profile-email" title="E-mail address">
          <EmailChangeForm user={user} />
        </ProfileSection>
        <ProfileSection id="profile-password" title="Password">
          <PasswordChangeForm />
        </ProfileSection>
      </div>
    </>
  );
}
