"""The beam and section panels, driven from Python: every valid edit is written to the inputs
file (comments kept) and shown; an invalid one is shown with its error and not written."""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest

from calcpack.inputs import beam_inputs, evaluate_beam, load_inputs
from calcpack.units import Q_
from calcpack.widgets import BeamPanel, SectionPanel, beam_panel, section_panel
from calcpack.widgets.fields import css_key, interactive_session

TEMPLATES = Path(__file__).resolve().parents[3] / "templates" / "sheets"


@pytest.fixture
def beam_file(tmp_path: Path) -> Path:
    p = tmp_path / "b.inputs.toml"
    shutil.copy(TEMPLATES / "beam.inputs.toml", p)
    return p


@pytest.fixture
def section_file(tmp_path: Path) -> Path:
    p = tmp_path / "s.inputs.toml"
    shutil.copy(TEMPLATES / "section.inputs.toml", p)
    return p


def _value(html: str, name: str) -> float:
    marker = f'data-out="{name}" data-value="'
    start = html.index(marker) + len(marker)
    return float(html[start : html.index('"', start)])


def test_beam_panel_edit_writes_file_and_matches_the_sheet(beam_file: Path) -> None:
    panel = beam_panel(beam_file)
    assert isinstance(panel, BeamPanel)
    before = panel.outcome
    assert before is not None
    panel.set("beam.spans[2]", Q_(5.0, "m"))
    text = beam_file.read_text(encoding="utf-8")
    assert 'spans = ["3.6 m", "5 m", "3.6 m"]' in text
    assert "# Inputs for the beam sheet." in text
    # What the panel shows is what a sheet computes from the written file.
    again = evaluate_beam(beam_inputs(load_inputs(beam_file)))
    assert panel.outcome is not None
    assert panel.outcome.bending_utilisation == again.bending_utilisation
    assert _value(panel.results.value, "bending_utilisation") == again.bending_utilisation
    assert again.bending_utilisation > before.bending_utilisation
    assert [d.value.count('class="cp-diagram"') for d in panel.drawings] == [1, 1, 1, 1]
    assert "Saved to b.inputs.toml" in panel.status.value


def test_beam_panel_field_edit_through_the_widget(beam_file: Path) -> None:
    panel = BeamPanel(beam_file)
    field = panel.fields["loads[1].w"]
    assert field.box.value == pytest.approx(1.2)
    assert css_key("loads[1].w") in field.box._dom_classes
    field.box.value = 2.4  # as typed in the browser
    assert load_inputs(beam_file)["loads"][0]["w"] == Q_(2.4, "kN/m")


def test_beam_panel_refuses_invalid_edit_without_writing(beam_file: Path) -> None:
    panel = BeamPanel(beam_file)
    before = beam_file.read_text(encoding="utf-8")
    panel.set("beam.spans[2]", Q_(-1.0, "m"))
    assert beam_file.read_text(encoding="utf-8") == before
    assert "Not saved" in panel.status.value
    assert "beam.spans[2]" in panel.status.value
    panel.set("combinations.strength.W", 1.5)
    assert "combinations.strength.W" in panel.status.value
    assert beam_file.read_text(encoding="utf-8") == before


def test_beam_panel_refuses_unstable_supports_and_keeps_the_last_solvable_beam(
    beam_file: Path,
) -> None:
    panel = BeamPanel(beam_file)
    for i in (1, 2, 3):  # one roller left: the beam is a mechanism
        panel.set(f"beam.supports[{i}]", "free")
    assert "unstable" in panel.status.value.lower() or "mechanism" in panel.status.value.lower()
    assert "Not saved" in panel.status.value
    # the edit that made a mechanism is not written; what is shown is what the file solves to
    on_file = load_inputs(beam_file)["beam"]["supports"]
    assert on_file.count("free") < 3
    assert panel.outcome is not None
    again = evaluate_beam(beam_inputs(load_inputs(beam_file)))
    assert panel.outcome.bending_utilisation == again.bending_utilisation
    assert all(d.value.count('class="cp-diagram"') == 1 for d in panel.drawings)


def test_beam_panel_adds_and_removes_spans(beam_file: Path) -> None:
    panel = BeamPanel(beam_file)
    panel._spans(+1)
    data = load_inputs(beam_file)
    assert len(data["beam"]["spans"]) == 4
    assert len(data["beam"]["supports"]) == 5
    assert "beam.spans[4]" in panel.fields
    panel._spans(-1)
    assert len(load_inputs(beam_file)["beam"]["spans"]) == 3


def test_beam_panel_changes_section_shape(beam_file: Path) -> None:
    panel = BeamPanel(beam_file)
    panel.set("section.shape", "i-section")
    data = load_inputs(beam_file)
    assert data["section"]["shape"] == "i-section"
    assert "section.tw" in panel.fields
    assert panel.outcome is not None


def test_beam_panel_reload_reads_hand_edits(beam_file: Path) -> None:
    panel = BeamPanel(beam_file)
    text = beam_file.read_text(encoding="utf-8").replace('f_b = "16 MPa"', 'f_b = "8 MPa"')
    beam_file.write_text(text, encoding="utf-8")
    u = panel.outcome.bending_utilisation if panel.outcome else 0.0
    panel.reload()
    assert panel.outcome is not None
    assert panel.outcome.bending_utilisation == pytest.approx(2 * u, rel=1e-12)


def test_section_panel_edits_and_refuses(section_file: Path) -> None:
    panel = section_panel(section_file)
    assert isinstance(panel, SectionPanel)
    Ix = panel.properties.Ix
    panel.set("section.d", Q_(400, "mm"))
    assert load_inputs(section_file)["section"]["d"] == Q_(400, "mm")
    assert panel.properties.Ix > Ix
    assert _value(panel.table.value, "Ix") == pytest.approx(
        panel.properties.Ix.to("mm**4").magnitude, rel=1e-12
    )
    assert 'data-diagram="section"' in panel.sketch.value
    before = section_file.read_text(encoding="utf-8")
    panel.set("section.tw", Q_(300, "mm"))  # wider than the flange
    assert section_file.read_text(encoding="utf-8") == before
    assert "tw" in panel.status.value
    panel.set("section.shape", "tube")
    assert load_inputs(section_file)["section"]["shape"] == "tube"
    assert set(panel.fields) == {"section.D", "section.t"}


def test_panels_display_nothing_outside_an_interactive_session(
    beam_file: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    monkeypatch.delenv("JPY_SESSION_NAME", raising=False)
    monkeypatch.delenv("CALCPACK_PANELS", raising=False)
    assert not interactive_session()
    monkeypatch.setenv("JPY_SESSION_NAME", "/x/sheet.ipynb")
    assert interactive_session()
    monkeypatch.setenv("CALCPACK_BUILDING", "1")
    assert not interactive_session()  # a build's kernel never shows panels


def test_beam_panel_adds_removes_and_recases_loads(beam_file: Path) -> None:
    panel = BeamPanel(beam_file)
    panel._add_load("point", "W")
    data = load_inputs(beam_file)
    assert data["loads"][-1]["case"] == "W"
    # A new case gets a factor in both combinations, shown in the panel to be set.
    assert data["combinations"]["strength"]["W"] == 1.0
    assert "combinations.strength.W" not in panel.fields  # factor boxes are plain numbers
    panel._case(4, "S")
    data = load_inputs(beam_file)
    assert "W" not in data["combinations"]["service"]
    assert data["combinations"]["service"]["S"] == 1.0
    panel._remove_load(4)
    data = load_inputs(beam_file)
    assert len(data["loads"]) == 3
    assert set(data["combinations"]["strength"]) == {"D", "L"}
    text = beam_file.read_text(encoding="utf-8")
    assert "# live load on the middle span only" in text  # other loads keep their comments


def test_beam_panel_sends_only_the_outputs_an_edit_changes(beam_file: Path) -> None:
    panel = BeamPanel(beam_file)
    sent: list[str] = []
    outputs = [*zip(("loading", "V", "M", "delta"), panel.drawings, strict=True)]
    for name, out in [*outputs, ("results", panel.results)]:
        out.observe(lambda _ch, n=name: sent.append(n), names="value")
    # f_b enters the bending check only: the drawings are unchanged and not sent again.
    panel.set("material.f_b", Q_(20, "MPa"))
    assert sent == ["results"]
    sent.clear()
    # E changes deflections only (V and M of a continuous beam of one EI do not depend on it).
    panel.set("material.E", Q_(9, "GPa"))
    assert sent == ["delta", "results"]
    sent.clear()
    panel.set("beam.spans[2]", Q_(5.0, "m"))
    assert sent == ["loading", "V", "M", "delta", "results"]


def test_beam_panel_writes_the_file_after_the_display_and_before_returning(
    beam_file: Path,
) -> None:
    panel = BeamPanel(beam_file)
    seen: list[str] = []
    panel.results.observe(
        lambda _ch: seen.append(beam_file.read_text(encoding="utf-8")), names="value"
    )
    panel.set("beam.spans[2]", Q_(5.0, "m"))
    # When the new results were handed to the front end the file still held the old span ...
    assert 'spans = ["3.6 m", "4.2 m", "3.6 m"]' in seen[0]
    # ... and by the time the edit returns (the kernel goes idle) it holds the new one.
    assert 'spans = ["3.6 m", "5 m", "3.6 m"]' in beam_file.read_text(encoding="utf-8")
    _started, display_s, saved_s = panel.edit_times[-1]
    assert 0 < display_s <= saved_s
    assert "Saved to b.inputs.toml" in panel.status.value


def test_waiting_for_the_output_thread(monkeypatch: pytest.MonkeyPatch) -> None:
    import threading

    from ipykernel.kernelbase import Kernel

    from calcpack.widgets.fields import wait_for_output_sent

    assert not Kernel.initialized()
    assert wait_for_output_sent() is False  # no kernel: nothing to wait for

    class OutputThread:
        """Runs scheduled callbacks later, in order, as ipykernel's IOPub thread does."""

        def __init__(self) -> None:
            self.queue: list[object] = ["update 1", "update 2"]
            self.sent: list[object] = []

        def schedule(self, f: object) -> None:
            def run() -> None:
                self.sent.extend(self.queue)
                f()  # type: ignore[operator]

            threading.Timer(0.05, run).start()

    thread = OutputThread()

    class FakeKernel:
        iopub_thread = thread

    monkeypatch.setattr(Kernel, "initialized", classmethod(lambda cls: True))
    monkeypatch.setattr(Kernel, "instance", classmethod(lambda cls: FakeKernel()))
    assert wait_for_output_sent() is True
    assert thread.sent == ["update 1", "update 2"]  # returned only after they were sent


def test_beam_panel_keeps_an_unchanged_section_and_its_properties(beam_file: Path) -> None:
    panel = BeamPanel(beam_file)
    assert panel.outcome is not None
    section = panel.outcome.inputs.section
    panel.set("beam.spans[1]", Q_(4.0, "m"))
    assert panel.outcome.inputs.section is section  # properties not worked out again
    fresh = evaluate_beam(beam_inputs(load_inputs(beam_file)))
    assert panel.outcome.sigma == fresh.sigma
    assert panel.outcome.bending_utilisation == fresh.bending_utilisation
    panel.set("section.d", Q_(240, "mm"))
    assert panel.outcome.inputs.section is not section
    fresh = evaluate_beam(beam_inputs(load_inputs(beam_file)))
    assert panel.outcome.properties.Ix == fresh.properties.Ix
    assert panel.outcome.bending_utilisation == fresh.bending_utilisation


def test_beam_panel_does_not_overwrite_a_file_broken_by_hand(beam_file: Path) -> None:
    panel = BeamPanel(beam_file)
    before = panel.data
    beam_file.write_text("[beam\nspans = ", encoding="utf-8")  # being edited in a text editor
    panel.set("beam.spans[2]", Q_(5.0, "m"))
    assert beam_file.read_text(encoding="utf-8") == "[beam\nspans = "
    assert "Not saved" in panel.status.value
    assert "not valid TOML" in panel.status.value
    assert "Reload file" in panel.status.value
    assert panel.data is before  # the next edit starts again from what the file last held


def test_beam_panel_marks_the_field_in_error_and_keeps_the_last_valid_display(
    beam_file: Path,
) -> None:
    panel = BeamPanel(beam_file)
    before_file = beam_file.read_text(encoding="utf-8")
    shown = [d.value for d in panel.drawings]
    results = panel.results.value
    field = panel.fields["beam.spans[2]"]
    field.box.value = -2.0  # as typed in the browser
    assert "cp-invalid" in field.box._dom_classes
    assert "beam.spans[2]" in field.error
    assert "-2" in field.error  # the value given
    assert "cp-error" in field.message.value
    # nothing else is marked, the file is untouched, the last valid display stays
    assert [k for k, f in panel.fields.items() if f.error] == ["beam.spans[2]"]
    assert beam_file.read_text(encoding="utf-8") == before_file
    assert [d.value for d in panel.drawings] == shown
    assert panel.results.value == results
    # a valid value clears the mark and is written
    field.box.value = 4.0
    assert field.error == ""
    assert "cp-invalid" not in field.box._dom_classes
    assert load_inputs(beam_file)["beam"]["spans"][1] == Q_(4.0, "m")


def test_section_panel_marks_the_field_in_error(section_file: Path) -> None:
    panel = SectionPanel(section_file)
    key = next(iter(panel.fields))
    before = section_file.read_text(encoding="utf-8")
    panel.fields[key].box.value = 0.0
    assert panel.fields[key].error
    assert "cp-invalid" in panel.fields[key].box._dom_classes
    assert section_file.read_text(encoding="utf-8") == before


def test_panels_carry_the_style_that_fits_drawings_to_the_notebook(beam_file: Path) -> None:
    """The drawings scale to the width they are given (max-width 100 %, height from the
    viewBox) and the drawings column wraps under the form; checked in a browser at two widths
    in tests/browser."""
    from calcpack.widgets.fields import PANEL_CSS

    panel = BeamPanel(beam_file)
    css = PANEL_CSS
    assert "svg{max-width:100%;height:auto}" in css.replace(" ", "")
    body = panel.widget.children[2]
    assert "cp-panel-body" in body._dom_classes
    assert "cp-panel-side" in body.children[1]._dom_classes
    assert all('viewBox="' in d.value for d in panel.drawings)


def test_rerun_control_names_what_is_stale_and_runs_the_cells_below(beam_file: Path) -> None:
    from calcpack.widgets.rerun import RUN_BELOW

    panel = BeamPanel(beam_file)
    ran: list[str] = []
    panel.rerun._execute = ran.append  # JupyterLab's command registry, recorded
    panel.set("beam.spans[2]", Q_(5.0, "m"))
    notice = panel.rerun.notice.value
    assert "stale" in notice
    assert "beam.spans[2] = 5 m" in notice
    assert ran == []  # nothing runs until asked
    panel.rerun.button.click()
    assert ran == [RUN_BELOW]
    assert panel.rerun.notice.value == ""
    # turned on: every saved edit re-runs the cells below; a refused edit does not
    panel.rerun.auto.value = True
    panel.set("loads[1].w", Q_(2.0, "kN/m"))
    assert ran == [RUN_BELOW, RUN_BELOW]
    panel.set("beam.spans[2]", Q_(-1.0, "m"))
    assert ran == [RUN_BELOW, RUN_BELOW]


def test_rerun_control_without_jupyterlab_commands_says_what_to_do(
    beam_file: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    from calcpack.widgets import rerun

    monkeypatch.setattr(rerun, "_front_end", lambda: None)
    panel = BeamPanel(beam_file)
    panel.rerun.button.click()
    assert "by hand" in panel.rerun.notice.value
    assert panel.rerun.runs == 0


def test_stale_notice_names_the_other_sheets_that_read_the_file(tmp_path: Path) -> None:
    """After an edit the notice names the job's other sheets reading the same inputs file
    (from the project file), those before the panel's notebook to be re-run first."""
    from calcpack.widgets.rerun import RerunControl, sheets_reading

    (tmp_path / "inputs").mkdir()
    (tmp_path / "sheets").mkdir()
    inputs = tmp_path / "inputs" / "design.toml"
    inputs.write_text("[beam]\nsection = 'W8X18'\n", encoding="utf-8")
    (tmp_path / "calcpack.toml").write_text(
        "\n".join(
            f'[[sheets]]\npath = "sheets/{name}.ipynb"\ninputs = [{reads}]\n'
            for name, reads in (
                ("01_loads", '"inputs/design.toml"'),
                ("02_beam", '"inputs/design.toml"'),
                ("03_footing", '"inputs/footing.toml"'),
                ("04_posts", '"inputs/design.toml"'),
            )
        ),
        encoding="utf-8",
    )
    found = sheets_reading(inputs, tmp_path / "sheets" / "02_beam.ipynb")
    assert found is not None
    assert (found.before, found.after) == (
        ("sheet 1 (sheets/01_loads.ipynb)",),
        ("sheet 4 (sheets/04_posts.ipynb)",),
    )
    unknown = sheets_reading(inputs, tmp_path / "elsewhere.ipynb")
    assert unknown is not None
    assert unknown.before == ()
    assert [n.split(" (")[0] for n in unknown.after] == ["sheet 1", "sheet 2", "sheet 4"]
    control = RerunControl(lambda _c: None, others=found)
    control.edited({"beam.section": "W10X12"})
    notice = control.notice.value
    assert "beam.section = W10X12" in notice
    assert "re-run sheet 1 (sheets/01_loads.ipynb) first" in notice
    assert "03_footing" not in notice  # it reads another file
    assert "re-run sheet 4 (sheets/04_posts.ipynb)." in notice
    # a file no sheet of the job reads names no other sheet
    other = sheets_reading(tmp_path / "inputs" / "spare.toml")
    assert other is not None
    assert other.notice() == ""
