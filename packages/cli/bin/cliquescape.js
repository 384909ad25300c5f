#!/usr/bin/env node
// Launcher kept outside dist/ so the installed link stays executable after a rebuild.
import "../dist/main.js";
