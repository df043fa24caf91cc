/** Light / dark theme, remembered in localStorage; defaults to the system preference. */
const KEY = 'beamwright.theme';

class Theme {
	current = $state<'light' | 'dark'>('light');
	constructor() {
		if (typeof document !== 'undefined') this.current = document.documentElement.dataset.theme === 'dark' ? 'dark' : 'light';
	}
	toggle() {
		this.current = this.current === 'dark' ? 'light' : 'dark';
		document.documentElement.dataset.theme = this.current;
		try {
			localStorage.setItem(KEY, this.current);
		} catch {
			/* storage blocked: the theme still applies for this visit */
		}
	}
}

export const theme = new Theme();
