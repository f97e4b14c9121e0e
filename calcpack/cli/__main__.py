from calcpack.cli import main

raise SystemExit(main())
