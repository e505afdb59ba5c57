"""A short table of typical values for the field in focus; picking a row fills the field."""

from __future__ import annotations

from rich.text import Text
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.coordinate import Coordinate
from textual.widgets import DataTable, Static

from fieldmode.calc.typical_values import Row, Table
from fieldmode.tui.widgets.dialog import Dialog


class LookupScreen(Dialog[Row | None]):
    """Up/Down to choose, Enter fills the field, Escape leaves it as it was.

    Under the table: the notes its source prints beside it, then the highlighted row's description,
    tabulated value and source in full (the columns are cut at 80 columns)."""

    DEFAULT_CSS = """
    LookupScreen .lookup-notes { height: auto; max-height: 2; }
    LookupScreen .lookup-source { height: auto; max-height: 2; }
    """

    ROWS_WITH_NOTES = 9
    """Table rows shown (with its header) when notes are shown too, so the dialog stays within 80x24."""

    BINDINGS = [Binding("escape", "dismiss", "close", id="table.close")]

    def __init__(self, table: Table, field_label: str) -> None:
        super().__init__()
        self.table = table
        self.field_label = field_label

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static(Text(f"{self.table.title} -> {self.field_label}", style="bold"))
            yield Static(Text(f"Enter fills the field, Escape closes. Fills {self.table.fills}."),
                         classes="dialog-note")
            grid: DataTable[str] = DataTable(cursor_type="row")
            grid.add_columns(" ", "fills", "what", "tabulated")
            for row in self.table.rows:
                grid.add_row(" ", row.fill, row.description, row.note)
            if self.table.notes:
                grid.styles.max_height = self.ROWS_WITH_NOTES
            yield grid
            if self.table.notes:
                yield Static(Text(" ".join(self.table.notes)), classes="dialog-note lookup-notes")
            yield Static("", classes="dialog-note lookup-source")

    def on_mount(self) -> None:
        self.query_one(DataTable).focus()

    def on_data_table_row_highlighted(self, event: DataTable.RowHighlighted) -> None:
        """Mark the row at the cursor with '>' (the highlight alone is a colour, lost with NO_COLOR)."""
        grid = event.data_table
        for index in range(grid.row_count):
            grid.update_cell_at(Coordinate(index, 0), ">" if index == event.cursor_row else " ")
        row = self.table.rows[event.cursor_row]
        self.query_one(".lookup-source", Static).update(Text(f"{row.description}: {row.note}; {row.source}"))

    def on_data_table_row_selected(self, event: DataTable.RowSelected) -> None:
        self.dismiss(self.table.rows[event.cursor_row])
