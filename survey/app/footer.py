"""The key footer: Textual's own, rebuilt only when the keys it shows change.

Textual's footer rebuilds its keys every time the focused widget changes, even when the
keys on show stay the same (moving from one field to the next in a form). Each rebuild mounts
and styles a dozen widgets; on a form walked by Enter that was most of the app's work per
keystroke. This footer compares what it would show with what it shows and keeps its keys when
they are the same."""

from __future__ import annotations

from collections.abc import Hashable

from textual.app import ComposeResult
from textual.screen import Screen
from textual.widgets import Footer


class KeysFooter(Footer):
    """A footer that rebuilds only when the keys on show change."""

    _shown: Hashable = None

    def _keys_on_show(self) -> Hashable:
        """What the footer would show now: each shown key with its label and state."""
        shown = tuple(
            (binding.key, binding.action, binding.description, enabled, tooltip, binding.group)
            for (_, binding, enabled, tooltip) in self.screen.active_bindings.values()
            if binding.show
        )
        return (shown, self.compact, self.show_command_palette)

    def compose(self) -> ComposeResult:
        if self._bindings_ready:
            self._shown = self._keys_on_show()
        yield from super().compose()

    def bindings_changed(self, screen: Screen) -> None:
        if (
            self._bindings_ready
            and screen.app.app_focus
            and self.is_attached
            and screen is self.screen
            and self._keys_on_show() == self._shown
        ):
            return
        super().bindings_changed(screen)
