import { describeDevice, timeAgo } from './session-words';

// User-agent strings in the shape the named browsers send them (from memory; version numbers invented).
const agents = {
  chromeLinux: 'Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/130.0.0.0 Safari/537.36',
  headlessChrome: 'Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) HeadlessChrome/130.0.0.0 Safari/537.36',
  firefoxWindows: 'Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:131.0) Gecko/20100101 Firefox/131.0',
  edgeWindows:
    'Mozilla/5.0 (Windows NT 10.0; Win64; x64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/130.0.0.0 Safari/537.36 Edg/130.0.0.0',
  safariMac: 'Mozilla/5.0 (Macintosh; Intel Mac OS X 10_15_7) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Safari/605.1.15',
  safariIphone:
    'Mozilla/5.0 (iPhone; CPU iPhone OS 17_5 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Mobile/15E148 Safari/604.1',
  chromeAndroidPhone: 'Mozilla/5.0 (Linux; Android 14; K) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/130.0.0.0 Mobile Safari/537.36',
  chromeIpad:
    'Mozilla/5.0 (iPad; CPU OS 17_5 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) CriOS/130.0.0.0 Mobile/15E148 Safari/604.1',
};

describe('describeDevice', () => {
  it('names the browser and the system in plain words', () => {
    expect(describeDevice(agents.chromeLinux)).toEqual({ name: 'Chrome on Linux', icon: 'computer' });
    expect(describeDevice(agents.headlessChrome).name).toBe('Chrome on Linux');
    expect(describeDevice(agents.firefoxWindows).name).toBe('Firefox on Windows');
    expect(describeDevice(agents.safariMac).name).toBe('Safari on macOS');
  });

  it('is not fooled by browsers that also announce Chrome or Safari, or phones that also announce Mac OS X or Linux', () => {
    expect(describeDevice(agents.edgeWindows).name).toBe('Edge on Windows');
    expect(describeDevice(agents.safariIphone)).toEqual({ name: 'Safari on iPhone', icon: 'smartphone' });
    expect(describeDevice(agents.chromeAndroidPhone)).toEqual({ name: 'Chrome on Android', icon: 'smartphone' });
    expect(describeDevice(agents.chromeIpad)).toEqual({ name: 'Chrome on iPad', icon: 'tablet' });
  });

  it('says so plainly when it cannot tell', () => {
    expect(describeDevice(null).name).toBe('Unknown browser');
    expect(describeDevice('a-script/2.1').name).toBe('Unknown browser');
    expect(describeDevice('Mozilla/5.0 (X11; Linux x86_64) SomethingNew/1.0').name).toBe('A browser on Linux');
  });
});

describe('timeAgo', () => {
  const now = new Date('2026-12-02T12:00:00Z');
  const before = (seconds: number) => new Date(now.getTime() - seconds * 1000).toISOString();

  it('counts back in minutes, hours and days, then gives the date', () => {
    expect(timeAgo(before(20), now)).toBe('just now');
    expect(timeAgo(before(60), now)).toBe('1 minute ago');
    expect(timeAgo(before(59 * 60 + 59), now)).toBe('59 minutes ago');
    expect(timeAgo(before(3 * 3600), now)).toBe('3 hours ago');
    expect(timeAgo(before(30 * 3600), now)).toBe('yesterday');
    expect(timeAgo(before(3 * 86_400), now)).toBe('3 days ago');
    expect(timeAgo('2026-11-02T12:00:00Z', now)).toBe('on Nov 2, 2026');
  });

  it('treats a clock a little ahead of this one as now', () => {
    expect(timeAgo(before(-5), now)).toBe('just now');
  });
});
