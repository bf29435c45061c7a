#!/usr/bin/env python3
"""docs/options.md must equal what `rotaweave --options-markdown` prints from the parameter
table, so the documented options, defaults and ranges never drift from the program."""
import os
import subprocess
import sys
from pathlib import Path

generated = subprocess.run([os.environ["ROTAWEAVE"], "--options-markdown"], capture_output=True, text=True, check=True).stdout
page = (Path(os.environ["ROTAWEAVE_SOURCE_DIR"]) / "docs" / "options.md").read_text()
ok = generated == page
print("ok   docs/options.md is current" if ok else "FAIL docs/options.md differs: regenerate with rotaweave --options-markdown > docs/options.md")
print(f"{int(ok)} passed, {int(not ok)} failed")
sys.exit(0 if ok else 1)
