/**
 * The frame around every signed-in screen. Phone-first: a compact header and a bottom bar
 * (with "More" for the rest); from the `wide` breakpoint a left side navigation instead.
 * Only the areas the user's role may open are offered (constants/areas.ts). The alarm banner
 * (components/alarms) sits under the header on every screen, for every role. Everything sits in a landmark
 * (banner, navigation, the alarm summary's region, main), so a screen reader can jump between them.
 */
import { usePathname } from 'expo-router';
import { useCallback, useEffect, useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { AlarmBanner } from '@/components/alarms/AlarmBanner';
import { areaForPath, areasForRole } from '@/constants/areas';
import { colors } from '@/constants/theme';
import { useSession } from '@/hooks/session/SessionProvider';
import type { SessionUser } from '@/hooks/session/storedSession';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { useDocumentTitle } from '@/hooks/useDocumentTitle';
import { AppHeader } from './AppHeader';
import { BottomBar } from './BottomBar';
import { MoreMenu } from './MoreMenu';
import { useScreenTitleFor } from './screenTitle';
import { SideNav } from './SideNav';

interface AppShellProps {
  user: SessionUser;
  children: ReactNode;
}

export function AppShell({ user, children }: AppShellProps) {
  const pathname = usePathname();
  const breakpoint = useBreakpoint();
  const { signOut } = useSession();
  const [moreOpen, setMoreOpen] = useState(false);
  const closeMore = useCallback(() => setMoreOpen(false), []);
  const toggleMore = useCallback(() => setMoreOpen((open) => !open), []);
  const onSignOut = useCallback(() => signOut('signed-out'), [signOut]);

  useEffect(() => {
    setMoreOpen(false);
  }, [pathname, breakpoint]);

  const allowed = areasForRole(user.role);
  const current = areaForPath(pathname);
  // A screen of one thing (a meter run) names it; otherwise the area's title.
  const title = useScreenTitleFor(pathname) ?? current?.title ?? 'Tallyrun';
  useDocumentTitle(title);

  if (breakpoint === 'wide') {
    return (
      <View style={styles.wide}>
        <SideNav areas={allowed} currentKey={current?.key} />
        <View style={styles.main}>
          <AppHeader title={title} user={user} onSignOut={onSignOut} compact={false} />
          <View role="region" aria-label="Alarm summary">
            <AlarmBanner />
          </View>
          <View style={styles.body} role="main">
            {children}
          </View>
        </View>
      </View>
    );
  }

  const primary = allowed.filter((area) => area.primary);
  const more = allowed.filter((area) => !area.primary);
  return (
    <View style={styles.narrow}>
      <AppHeader title={title} user={user} onSignOut={onSignOut} compact={breakpoint === 'phone'} />
      <View role="region" aria-label="Alarm summary">
        <AlarmBanner />
      </View>
      <View style={styles.body} role="main">
        {children}
        {moreOpen ? <MoreMenu areas={more} currentKey={current?.key} onClose={closeMore} /> : null}
      </View>
      <BottomBar
        primary={primary}
        hasMore={more.length > 0}
        moreOpen={moreOpen}
        moreCurrent={more.some((area) => area.key === current?.key)}
        currentKey={current?.key}
        onToggleMore={toggleMore}
        onNavigate={closeMore}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wide: { flex: 1, flexDirection: 'row', backgroundColor: colors.background },
  narrow: { flex: 1, backgroundColor: colors.background },
  main: { flex: 1, minWidth: 0 },
  body: { flex: 1, minHeight: 0 },
});
