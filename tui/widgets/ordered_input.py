"""A text box that keeps a burst of keys in the order typed, for fields and dialogs alike."""

from __future__ import annotations

from textual import events
from textual.widgets import Input

from fieldmode.tui.widgets.dialog import hand_to_dialog


class OrderedInput(Input):
    """A text box whose bound keys (Home, Backspace, Ctrl+K, Tab, F-keys) run as they arrive.

    Textual runs the key bindings of a focused widget only after the key has bubbled up to the
    app, so when keystrokes arrive together (over SSH they often do) typed characters overtook a
    Home, Backspace or Ctrl+K typed before them: 'Home Ctrl+K x y z' left the box empty. Here every
    bound key runs as it arrives, and characters that arrive after a key moved the focus elsewhere
    follow the focus, into a dialog that key opened too.
    """

    async def _on_key(self, event: events.Key) -> None:
        if hand_to_dialog(self, event):  # typed after the key that opened a dialog
            return
        focused = self.app.focused
        if focused is not None and focused is not self:
            event.stop()
            event.prevent_default()
            focused.post_message(events.Key(event.key, event.character))
            return
        if not event.is_printable and await self._run_binding(event.key):
            event.stop()
            event.prevent_default()
            return
        await super()._on_key(event)

    async def _run_binding(self, key: str) -> bool:
        """Run the first binding of ``key`` that acts, from this box up to the app, as Textual does after
        the key bubbled: a binding whose action declines (the box's own PageDown, with nothing to scroll)
        leaves the key to the next one (the app's, which scrolls the results). True when one acted."""
        for node, bindings in self.screen._modal_binding_chain:
            for binding in bindings.key_to_bindings.get(key, ()):
                if not binding.priority and await self.app.run_action(binding.action, node):
                    return True
        return False
