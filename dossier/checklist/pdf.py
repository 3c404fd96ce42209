"""Writing the printable checklist to PDF with WeasyPrint (a Python renderer; needs Pango from the system)."""

from __future__ import annotations

from pathlib import Path

SYSTEM_PACKAGES = "libpango-1.0-0 libpangoft2-1.0-0 fonts-dejavu-core"


class PdfUnavailable(RuntimeError):
    """The PDF renderer cannot run here; the message says what to install."""


def _renderer():
    try:
        import weasyprint
    except (ImportError, OSError) as error:  # OSError: Pango's shared libraries are missing
        raise PdfUnavailable(
            f"cannot write PDF: {error}. Install the Python package 'weasyprint' and, on Debian, "
            f"apt-get install {SYSTEM_PACKAGES}"
        ) from None
    return weasyprint


def write_pdf(html: str, path: Path) -> Path:
    """Render one standalone HTML page to a PDF file; returns the path written."""
    weasyprint = _renderer()
    path = Path(path)
    path.parent.mkdir(parents=True, exist_ok=True)
    weasyprint.HTML(string=html, base_url=str(path.parent)).write_pdf(str(path))
    return path


def pdf_name(build: str, revision: str, paper: str) -> str:
    """'checklist-sw-charger-12v-rev-C-a4.pdf'."""
    return f"checklist-{build}-rev-{revision}-{paper}.pdf"


def write_checklist_pdfs(loaded, findings, folder: Path, commissioning=None) -> dict[str, Path]:
    """The sheet on A4 and on US Letter, for the site build; returns paper -> path."""
    from dossier.checklist.page import PAPER, checklist_html

    record = loaded.record
    return {
        paper: write_pdf(checklist_html(loaded, findings, paper, commissioning), Path(folder) / pdf_name(record.id, record.revision, paper))
        for paper in PAPER
    }
