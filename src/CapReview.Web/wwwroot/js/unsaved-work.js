// The browser's half of the unsaved-work guard (UnsavedWorkGuard.razor). The page's state lives on the server, so the
// browser only says "something may have changed" after the user typed, chose or clicked, and keeps the page's working
// copy in localStorage. A module file, not an inline script: the Content-Security-Policy allows scripts from the app only.

const quietMilliseconds = 300;

/**
 * Calls the guard's CheckAsync once input has been quiet a moment, and asks before the page is left while the guard
 * says there is unsaved work: a link (the app's links are followed by Blazor's enhanced navigation, which no server-side
 * navigation handler sees) and a reload, a typed address or a closed tab (the browser's own question).
 * Returns a handle: setUnsaved(flag, question) and dispose().
 */
export function watch(guard) {
    let timer = 0;
    let unsaved = false;
    let question = '';
    let leaving = false;
    const notify = () => {
        clearTimeout(timer);
        timer = setTimeout(() => guard.invokeMethodAsync('CheckAsync').catch(() => { /* the page has gone */ }), quietMilliseconds);
    };
    const onClick = event => {
        if (!unsaved || event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) {
            return;
        }
        const link = event.target instanceof Element ? event.target.closest('a[href]') : null;
        if (!link || link.hasAttribute('download') || (link.target && link.target !== '_self')) {
            return;
        }
        const url = new URL(link.href, document.baseURI);
        if (url.pathname === location.pathname && url.search === location.search && url.hash) {
            return;
        }
        if (window.confirm(question)) {
            leaving = true;
        } else {
            event.preventDefault();
            event.stopImmediatePropagation();
        }
    };
    const onBeforeUnload = event => {
        if (unsaved && !leaving) {
            event.preventDefault();
            event.returnValue = '';
        }
    };
    const types = ['input', 'change', 'click', 'keyup'];
    for (const type of types) {
        document.addEventListener(type, notify, true);
    }
    // On the window in the capture phase: before Blazor's own listener follows the link.
    window.addEventListener('click', onClick, true);
    window.addEventListener('beforeunload', onBeforeUnload);
    return {
        setUnsaved(flag, text) {
            unsaved = flag;
            question = text;
        },
        dispose() {
            clearTimeout(timer);
            for (const type of types) {
                document.removeEventListener(type, notify, true);
            }
            window.removeEventListener('click', onClick, true);
            window.removeEventListener('beforeunload', onBeforeUnload);
        },
    };
}

/** The stored copy, or null; a browser that refuses storage (private mode, policy) has none. */
export function read(key) {
    try {
        return window.localStorage.getItem(key);
    } catch {
        return null;
    }
}

/** Keeps the copy; false when the browser refuses (full or disabled storage), so the page does not promise it. */
export function write(key, value) {
    try {
        window.localStorage.setItem(key, value);
        return true;
    } catch {
        return false;
    }
}

export function remove(key) {
    try {
        window.localStorage.removeItem(key);
    } catch {
        // Nothing was kept.
    }
}
