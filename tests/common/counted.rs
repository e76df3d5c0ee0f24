//! Property tests that count what they test. A generated input the property does not
//! apply to (a ruleset that does not load, say) is a reject; each test runs a fixed number
//! of inputs, prints how many it tested and rejected, and fails when fewer than its floor
//! were tested, so a generator that drifts into invalid inputs cannot pass by testing
//! nothing.

use std::sync::atomic::{AtomicUsize, Ordering};

use proptest::strategy::Strategy;
use proptest::test_runner::{Config, TestCaseError, TestRunner};

/// What one input did.
pub enum Case {
    Tested,
    Rejected,
}

/// Runs `property` on `cases` inputs drawn from `strategy`; fails (with proptest's
/// shrunk counterexample) when the property fails, and when fewer than `floor` of the
/// inputs were tested rather than rejected.
pub fn check<S: Strategy>(
    name: &str,
    cases: u32,
    floor: f64,
    strategy: S,
    property: impl Fn(S::Value) -> Result<Case, TestCaseError>,
) {
    let (tested, rejected) = (AtomicUsize::new(0), AtomicUsize::new(0));
    let mut runner = TestRunner::new(Config {
        cases,
        // Inputs are counted here, not rejected through proptest, so its own reject
        // budget never ends a run early.
        failure_persistence: None,
        ..Config::default()
    });
    let outcome = runner.run(&strategy, |value| {
        match property(value)? {
            Case::Tested => tested.fetch_add(1, Ordering::Relaxed),
            Case::Rejected => rejected.fetch_add(1, Ordering::Relaxed),
        };
        Ok(())
    });
    let (tested, rejected) = (tested.into_inner(), rejected.into_inner());
    eprintln!("{name}: {tested} inputs tested, {rejected} rejected");
    if let Err(e) = outcome {
        panic!("{name}: {e}");
    }
    assert!(
        tested as f64 >= floor * f64::from(cases),
        "{name}: only {tested} of {cases} inputs were tested ({rejected} rejected); the floor \
         is {:.0}%: fix the generator",
        floor * 100.0
    );
}
