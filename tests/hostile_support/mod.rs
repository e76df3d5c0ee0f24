//! Running `lexdelta` on hostile input, for `tests/hostile_*.rs`: its exit code, output, and
//! the CPU time it used (user + system, measured for that one process with `wait4`, so a
//! busy machine or tests running side by side do not count against it).

#![allow(dead_code)]

use std::io::Read;
use std::path::Path;
use std::process::{Command, Stdio};
use std::time::{Duration, Instant};

/// Each run's CPU time must stay under this.
pub const LIMIT: Duration = Duration::from_secs(2);
/// And its wall time under this, however busy the machine (a hang is not a slow run).
pub const WALL: Duration = Duration::from_secs(30);

pub struct Run {
    pub code: i32,
    pub stdout: String,
    pub stderr: String,
    pub cpu: Duration,
}

fn drain(mut pipe: impl Read + Send + 'static) -> std::thread::JoinHandle<Vec<u8>> {
    std::thread::spawn(move || {
        let mut out = Vec::new();
        let _ = pipe.read_to_end(&mut out);
        out
    })
}

/// Runs `lexdelta ARGS` in `dir` and checks it did not panic and kept to the limits.
// The child is reaped by `wait4`, which clippy does not see.
#[allow(clippy::zombie_processes)]
pub fn lexdelta(dir: &Path, args: &[&str]) -> Run {
    let start = Instant::now();
    let mut child = Command::new(env!("CARGO_BIN_EXE_lexdelta"))
        .current_dir(dir)
        .env("NO_COLOR", "1")
        .args(args)
        .stdin(Stdio::null())
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    let stdout = drain(child.stdout.take().unwrap());
    let stderr = drain(child.stderr.take().unwrap());
    let mut status = 0;
    let mut usage: libc::rusage = unsafe { std::mem::zeroed() };
    // SAFETY: waits for our own child, writing into the two locals.
    let pid = unsafe { libc::wait4(child.id() as libc::pid_t, &mut status, 0, &mut usage) };
    assert_eq!(pid, child.id() as libc::pid_t, "wait4");
    let wall = start.elapsed();
    let time = |t: libc::timeval| Duration::new(t.tv_sec as u64, t.tv_usec as u32 * 1000);
    let cpu = time(usage.ru_utime) + time(usage.ru_stime);
    let code = if libc::WIFEXITED(status) {
        libc::WEXITSTATUS(status)
    } else {
        -1
    };
    let run = Run {
        code,
        stdout: String::from_utf8_lossy(&stdout.join().unwrap()).into_owned(),
        stderr: String::from_utf8_lossy(&stderr.join().unwrap()).into_owned(),
        cpu,
    };
    assert!(
        !run.stderr.contains("panicked") && run.code != 101 && run.code != -1,
        "{args:?} panicked or was killed ({}):\n{}",
        run.code,
        run.stderr
    );
    assert!(run.cpu < LIMIT, "{args:?} used {:?} of CPU", run.cpu);
    assert!(wall < WALL, "{args:?} took {wall:?}");
    run
}
