import sys

from conductor_atlas.cli import main

sys.exit(main())
