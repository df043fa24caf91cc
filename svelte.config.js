import adapter from '@sveltejs/adapter-static';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	kit: {
		adapter: adapter({ pages: 'build', assets: 'build', fallback: undefined, precompress: false, strict: true }),
		// Registered by the root layout once the first view is drawn, so caching never slows the first load.
		serviceWorker: { register: false }
	}
};

export default config;
