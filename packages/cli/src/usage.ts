/** Usage texts, printed with a usage error of that command. */

export const USAGE: Readonly<Record<string, string>> = {
  main: `lightkiln: bake HDR environments into image-based lighting assets

usage:
  lightkiln bake <input...> --out <dir> [options]   bake probes (specular cube, irradiance, DFG table, manifest)
  lightkiln lut --out <file.ktx2> [options]        bake the DFG lookup table alone
  lightkiln inspect <file...>                      summarise a .ktx2, .hdr, .exr, .pfm, .png or manifest
  lightkiln preview <probe.json> --out <file.png>  render the contact sheet of a baked probe
  lightkiln cache <stats|verify|prune|clear>       look after the bake cache
  lightkiln sweep <input> --out <dir>              error versus time for sample budgets and methods
  lightkiln farm worker|submit ...                 bake on many machines (Redis queue, shared cache)

common options: --json  --quiet  --threads N  --no-cache  --cache-dir D
run "lightkiln <command> --help" for a command's options`,
  bake: `usage: lightkiln bake <input...> --out <dir> [options]
       lightkiln bake --batch <recipes.json> --out <dir> [options]

  --out DIR            output folder (created if missing)                      required
  --size N             level-0 face size, power of two 4..4096                 default 256
  --levels N           radiance levels                                         default to 8x8 (4x4 <256)
  --samples S          draft | default | high | N samples per texel             default default
  --rotate DEG         rotation about +Y, degrees (positive turns +Z to +X)    default 0
  --format F           rgba16f | rgba32f | rgb9e5 | b10g11r11 (specular cube)  default rgba16f
  --irradiance-size N  irradiance cube face size                               default 32
  --no-filtered        plain importance sampling (no source mip per sample)
  --zstd               Zstandard supercompression in the KTX 2.0 files (scheme 2)
  --zlib               zlib supercompression in the KTX 2.0 files (scheme 3)
  --views              also write .hdr crosses of level 0 and the irradiance
  --preview            also write <name>.preview.png, the contact sheet
  --name NAME          probe name (one input only)                             default input file name
  --recipe FILE        JSON recipe fields applied to every input (flags win)
  --batch FILE         JSON list of recipes (input paths relative to the file)
  --depfile FILE       write a Make-syntax depfile: artifacts <- inputs, recipe, batch file
  --events             JSON lines on stderr: stage, progress, cache, artifact events
  --threads N          worker threads (0 = inline)                             default all cores
  --no-cache           do not read or write the cache
  --cache-dir DIR      cache folder                                            default .lightkiln-cache
  --remote-cache URL   shared cache server (HTTP build-cache protocol) behind the folder
  --json               print one JSON document on stdout
  --quiet              no progress on stderr`,
  lut: `usage: lightkiln lut --out <file.ktx2> [options]

  --out FILE       output .ktx2 file                       required
  --size N         table size, 8..1024                     default 128
  --samples N      samples per texel                       default 1024
  --multiscatter   add E_avg(r) as a third channel
  --cloth          add the cloth (sheen) albedo channel
  --zstd           Zstandard supercompression
  --zlib           zlib supercompression
  --threads N, --no-cache, --cache-dir DIR, --json, --quiet`,
  inspect: `usage: lightkiln inspect <file...> [--json]`,
  sweep: `usage: lightkiln sweep <input> --out <dir> [options]

  --size N          level-0 face size (the reference convolution costs size^4)   default 64
  --budgets LIST    samples per texel, comma-separated, and/or "default"          default 16,32,...,2048,default
  --methods LIST    plain, filtered, filtered-rotated                             default all
  --repeats N       timed runs per point (median reported)                        default 3
  --lod-bias B      filtered importance sampling bias (levels)                    default 0.5
  --threads N, --json, --quiet`,
  preview: `usage: lightkiln preview <probe.probe.json> --out <file.png> [--exposure EV] [--json]`,
  cache: `usage: lightkiln cache stats|verify|clear [--cache-dir DIR] [--json]
       lightkiln cache prune --max-bytes N [--cache-dir DIR] [--json]`,
  farm: `usage: lightkiln farm worker --redis <url> --remote-cache <url> [--queue NAME] [--threads N] [--cache-dir D] [--lock-ms MS]
       lightkiln farm submit <input...> | --batch <file> --redis <url> --remote-cache <url> --out <dir> [options]

  worker: takes bake jobs until SIGINT or SIGTERM (then finishes the job in progress)
  submit: uploads inputs to the shared cache, queues one job per probe (duplicates bake once), shows
          progress on stderr, writes every artifact into --out; recipe options as for bake
  --redis URL          redis://[user:password@]host:port (configured maxmemory-policy noeviction)
  --remote-cache URL   the shared cache server (HTTP build-cache protocol)
  --queue NAME         queue name                                              default lightkiln-bakes
  --lock-ms MS         worker: job lock; a dead worker's job moves on within 1.5x  default 10000
  --events             submit: JSON lines on stderr: job (submitted, completed, failed), progress,
                       artifact events
  --json, --quiet`,
};
