"""The base of every dialog: keys typed right after the key that opened it are kept for it."""

from __future__ import annotations

from typing import TypeVar

from textual import events
from textual.screen import ModalScreen
from textual.widget import Widget

ResultType = TypeVar("ResultType")


class Dialog(ModalScreen[ResultType]):
    """A modal screen that receives, in order, the keys typed while it was opening.

    Keys that arrive together with the key that opens a dialog (over SSH they often do)
    were handed to the field in focus before the dialog existed, and keys that arrive
    while the dialog is being built find nothing in focus. Both are held here
    (:meth:`take_key`, :meth:`on_key`) and given to the dialog's first focused widget
    the moment it takes the focus.
    """

    def __init__(self, classes: str = "dialog-screen") -> None:
        super().__init__(classes=classes)
        self._held: list[events.Key] = []

    def take_key(self, key: str, character: str | None) -> None:
        """A key meant for this dialog: to its focused widget, or held until one has the focus."""
        if self.focused is None:
            self._held.append(events.Key(key, character))
        else:
            self.focused.post_message(events.Key(key, character))

    def on_key(self, event: events.Key) -> None:
        """A key sent to the dialog itself because nothing in it had the focus yet: hold it."""
        if self.focused is None:
            event.stop()
            event.prevent_default()
            self._held.append(events.Key(event.key, event.character))

    def set_focus(self, widget: Widget | None, scroll_visible: bool = True, from_app_focus: bool = False) -> None:
        """Focus ``widget``, then give it the held keys before any key that arrives later."""
        super().set_focus(widget, scroll_visible, from_app_focus)
        focused = self.focused
        if focused is not None and self._held:
            held, self._held = self._held, []
            for event in held:
                focused.post_message(event)


def hand_to_dialog(widget: Widget, event: events.Key) -> bool:
    """If a dialog opened above ``widget``'s screen, give it ``event`` (True); else False.

    For widgets of a screen below a dialog that still receive keys of the burst that
    opened the dialog.
    """
    top = widget.app.screen
    if top is widget.screen or not isinstance(top, Dialog):
        return False
    event.stop()
    event.prevent_default()
    top.take_key(event.key, event.character)
    return True
